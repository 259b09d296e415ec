import { BadRequestException } from '@nestjs/common';
import { parse } from 'csv-parse';
import { Readable } from 'node:stream';
import { CSV_PARSE_OPTIONS, csvReadProblem, type CsvRowReader, type UploadProblem } from '@sixtyfold/shared';

/** A refused upload as a 400 whose body carries the line, for the web to show beside the file. */
export function uploadBadRequest(problem: UploadProblem): BadRequestException {
  return new BadRequestException({ message: problem.message, ...(problem.line !== undefined ? { line: problem.line } : {}) });
}

/**
 * Streams an uploaded CSV through csv-parse into a shared row reader: the first record is the
 * header, each later one is checked as it arrives, and the first bad row ends the read with a
 * 400 that names its line. Blank lines and lines starting with # are skipped (CSV_PARSE_OPTIONS).
 */
export async function readCsvUpload<T>(file: Express.Multer.File | undefined, field: string, reader: CsvRowReader<T>): Promise<T> {
  if (!file) throw new BadRequestException(`Attach the CSV file as the multipart field "${field}"`);
  const parser = Readable.from([file.buffer]).pipe(parse({ ...CSV_PARSE_OPTIONS, info: true }));
  let first = true;
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      if (first) reader.header(record, info.lines);
      else reader.row(record, info.lines);
      first = false;
    }
    return reader.finish();
  } catch (error) {
    parser.destroy();
    const problem = csvReadProblem(error);
    throw problem ? uploadBadRequest(problem) : error;
  }
}
