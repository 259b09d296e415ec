import { BadRequestException } from '@nestjs/common';
import { parse, CsvError } from 'csv-parse';
import { Readable } from 'node:stream';
import { UploadRejected, type CsvRowReader, type UploadProblem } from '@sixtyfold/shared';

/** A refused upload as a 400 whose body carries the line, for the web to show beside the file. */
export function uploadBadRequest(problem: UploadProblem): BadRequestException {
  return new BadRequestException({ message: problem.message, ...(problem.line !== undefined ? { line: problem.line } : {}) });
}

/**
 * Streams an uploaded CSV through csv-parse into a shared row reader: the first record is the
 * header, each later one is checked as it arrives, and the first bad row ends the read with a
 * 400 that names its line. Blank lines and lines starting with # are skipped (for notes).
 */
export async function readCsvUpload<T>(file: Express.Multer.File | undefined, field: string, reader: CsvRowReader<T>): Promise<T> {
  if (!file) throw new BadRequestException(`Attach the CSV file as the multipart field "${field}"`);
  const parser = Readable.from([file.buffer]).pipe(
    parse({ bom: true, trim: true, skip_empty_lines: true, comment: '#', comment_no_infix: true, relax_column_count: true, info: true }),
  );
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
    if (error instanceof UploadRejected) throw uploadBadRequest({ message: error.message, line: error.line });
    if (error instanceof CsvError) {
      const line = (error as CsvError & { lines?: number }).lines;
      const reason = error.message.replace(/^Invalid [^:]*: /, '');
      throw uploadBadRequest({ message: line ? `line ${line}: the file is not valid CSV: ${reason}` : `the file is not valid CSV: ${reason}`, line });
    }
    throw error;
  }
}
