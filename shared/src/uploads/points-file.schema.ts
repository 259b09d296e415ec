import { z } from 'zod';
import { PIVOT_AXES, POINT_LIST_MAX_POINTS, type PointList } from '../schemas/scan.schema.js';
import { csvNumber, UploadRejected, type CsvRowReader } from './upload-problem.js';

/** Room for the largest list (POINT_LIST_MAX_POINTS rows) with several long-decimal columns. */
export const POINTS_CSV_MAX_BYTES = 8 * 1024 * 1024;

/**
 * The text field sent beside the points file in `POST /api/scans/upload`: the create-scan body
 * as JSON, without `axes` or `pointList` (the file gives the points).
 */
export const scanUploadFieldsSchema = z.object({
  spec: z.string({ error: 'send the scan settings as JSON in the field spec' }).describe('The create-scan body as JSON, without axes or pointList'),
});
export type ScanUploadFields = z.infer<typeof scanUploadFieldsSchema>;

/** A points file as read: the list, and the line of its header (where column problems are reported). */
export interface PointsFile {
  pointList: PointList;
  headerLine: number;
}

/**
 * Reads a scan's points file (documented in DEVELOPERS.md, "File formats"): a header naming
 * what each row sets (model parameters, and nStar, reheatingW or reheatingEnergyGeV as an axis
 * would), then one point per row, finite numbers only, at most `maxRows` rows. With `parameters`
 * (the model's), any other column is refused at once; without it the API checks them against
 * the model after reading, and reports them on the header line too.
 */
export function pointsCsvReader({ parameters, maxRows = POINT_LIST_MAX_POINTS }: { parameters?: string[]; maxRows?: number } = {}): CsvRowReader<PointsFile> {
  const rows: number[][] = [];
  let columns: string[] | undefined;
  let headerLine = 1;
  return {
    header(names, line) {
      headerLine = line;
      const seen = new Set<string>();
      names.forEach((name, i) => {
        if (name === '') throw new UploadRejected(`column ${i + 1} of the header has no name`, line);
        if (seen.has(name)) throw new UploadRejected(`column ${name} appears twice`, line);
        seen.add(name);
      });
      if (parameters) {
        const known = [...parameters, ...PIVOT_AXES];
        const unknown = names.filter((n) => !known.includes(n));
        if (unknown.length) {
          throw new UploadRejected(`unknown column${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')}; the columns can be ${known.join(', ')}`, line);
        }
      }
      columns = names;
    },
    row(values, line) {
      const names = columns!;
      if (values.length !== names.length) {
        throw new UploadRejected(`expected ${names.length} value${names.length > 1 ? 's' : ''} (${names.join(', ')}), found ${values.length}`, line);
      }
      if (rows.length >= maxRows) throw new UploadRejected(`a points file has at most ${maxRows.toLocaleString('en-US')} points`, line);
      rows.push(values.map((value, c) => csvNumber(value, names[c], line)));
    },
    finish() {
      if (!columns) throw new UploadRejected('the file is empty; it needs a header naming the columns, then one point per line');
      if (rows.length === 0) throw new UploadRejected('the file has a header but no points', headerLine);
      return { pointList: { columns, rows }, headerLine };
    },
  };
}
