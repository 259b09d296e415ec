import { describe, expect, it } from 'vitest';
import { csvReadProblem, UploadRejected } from './upload-problem.js';

/** An error shaped as csv-parse makes them: a code and the line it stopped at. */
const csvParseError = (code: string, message: string, lines: number) => Object.assign(new Error(message), { code, lines });

describe('csvReadProblem', () => {
  it('reports a reader refusal with its line', () => {
    expect(csvReadProblem(new UploadRejected('column f is empty', 3))).toEqual({ message: 'line 3: column f is empty', line: 3 });
  });

  it('reports csv-parse refusals on their line, the quote in an unquoted cell among them', () => {
    expect(csvReadProblem(csvParseError('CSV_QUOTE_NOT_CLOSED', 'Quote Not Closed: the parsing is finished with an opening quote at line 4', 4))).toEqual({
      message: 'line 4: the file is not valid CSV: Quote Not Closed: the parsing is finished with an opening quote at line 4',
      line: 4,
    });
    expect(csvReadProblem(csvParseError('INVALID_OPENING_QUOTE', 'Invalid Opening Quote: a quote is found on field 0 at line 2, value is "$"', 2))).toEqual({
      message: 'line 2: the file is not valid CSV: a quote is found on field 0 at line 2, value is "$"',
      line: 2,
    });
  });

  it('leaves other errors alone', () => {
    expect(csvReadProblem(new TypeError('x is undefined'))).toBeNull();
    expect(csvReadProblem(Object.assign(new Error('Redis went away'), { code: 'ECONNRESET' }))).toBeNull();
  });
});
