import { CSV_PARSE_OPTIONS, csvReadProblem, pointsCsvReader, type PointList, type PointsFile, type UploadProblem } from '@sixtyfold/shared';
import { parse } from 'csv-parse/browser/esm/sync';

export type PointsFileRead = ({ ok: true } & PointsFile) | ({ ok: false } & UploadProblem);

/**
 * Reads a points file in the browser as the API will: the same csv-parse options and the same
 * shared reader, so a refusal shows with its line before anything is sent. `parameters` are the
 * chosen model's, so an unknown column is named at once.
 */
export function readPointsFile(text: string, parameters: string[]): PointsFileRead {
  const reader = pointsCsvReader({ parameters });
  try {
    const records = parse(text, { ...CSV_PARSE_OPTIONS, info: true }) as unknown as { record: string[]; info: { lines: number } }[];
    records.forEach(({ record, info }, i) => (i === 0 ? reader.header(record, info.lines) : reader.row(record, info.lines)));
    return { ok: true, ...reader.finish() };
  } catch (error) {
    const problem = csvReadProblem(error);
    if (!problem) throw error;
    return { ok: false, ...problem };
  }
}

/**
 * A stored point list as the points file it came from (header, then one row per point), so a
 * copied scan starts with its points chosen; `String(x)` keeps every double exactly.
 */
export function pointsFileOf(list: PointList, name: string): { file: File; text: string } {
  const lines = [list.columns.join(','), ...list.rows.map((row) => row.map(String).join(','))];
  const text = `${lines.join('\n')}\n`;
  return { file: new File([text], name, { type: 'text/csv' }), text };
}
