import { z } from 'zod';
import { checkCsvHeader, csvNumber, UploadRejected, type CsvRowReader } from './upload-problem.js';

export const REGION_CSV_MAX_BYTES = 1024 * 1024;
export const REGION_MAX_VERTICES = 10_000;
export const REGION_MIN_VERTICES = 3;

/** One boundary point of a region in the n_s–r plane. */
export const regionVertexSchema = z.object({ ns: z.number(), r: z.number() });
export type RegionVertex = z.infer<typeof regionVertexSchema>;

/** A group's observational constraint region, as the API returns it. */
export const constraintRegionSchema = z.object({
  id: z.number().int(),
  groupId: z.number().int(),
  name: z.string(),
  source: z.string(),
  confidenceLevel: z.number(),
  vertices: z.array(regionVertexSchema),
  createdById: z.number().int().nullable(),
  createdAt: z.string(),
});
export type ConstraintRegion = z.infer<typeof constraintRegionSchema>;

/**
 * The form fields sent beside the CSV file in `POST /api/constraint-regions`. Multipart fields
 * arrive as text, so numbers are coerced.
 */
export const constraintRegionUploadSchema = z.object({
  groupId: z.coerce.number({ error: 'choose the group' }).int().positive('choose the group'),
  name: z.string({ error: 'give the region a name' }).trim().min(1, 'give the region a name').max(120, 'a region name has at most 120 characters'),
  source: z
    .string({ error: 'say where the region comes from (paper, data release)' })
    .trim()
    .min(1, 'say where the region comes from (paper, data release)')
    .max(500, 'the source has at most 500 characters'),
  confidenceLevel: z.coerce
    .number({ error: 'give the confidence level, e.g. 0.95' })
    .gt(0, 'the confidence level lies strictly between 0 and 1, e.g. 0.95')
    .lt(1, 'the confidence level lies strictly between 0 and 1, e.g. 0.95'),
});
export type ConstraintRegionUpload = z.infer<typeof constraintRegionUploadSchema>;

/**
 * Reads a region's CSV: a header `n_s,r`, then one boundary vertex per row (in order around the
 * outline; the outline is closed when drawn), 0 < n_s < 2, r ≥ 0, at least three vertices.
 */
export function regionCsvReader(): CsvRowReader<RegionVertex[]> {
  const vertices: RegionVertex[] = [];
  let columns: string[] | undefined;
  return {
    header(names, line) {
      checkCsvHeader(names, ['n_s', 'r'], line);
      columns = names;
    },
    row(values, line) {
      if (!columns) throw new UploadRejected('the first line must be the header n_s,r', line);
      if (values.length !== columns.length) {
        throw new UploadRejected(`expected ${columns.length} values (${columns.join(', ')}), found ${values.length}`, line);
      }
      if (vertices.length >= REGION_MAX_VERTICES) throw new UploadRejected(`a region has at most ${REGION_MAX_VERTICES} vertices`, line);
      const cell = (name: string) => csvNumber(values[columns!.indexOf(name)], name, line);
      const ns = cell('n_s');
      const r = cell('r');
      if (!(ns > 0 && ns < 2)) throw new UploadRejected(`n_s must lie between 0 and 2 (found ${ns})`, line);
      if (r < 0) throw new UploadRejected(`r cannot be negative (found ${r})`, line);
      vertices.push({ ns, r });
    },
    finish() {
      if (!columns) throw new UploadRejected('the file is empty; it needs the header n_s,r and at least three vertices');
      if (vertices.length < REGION_MIN_VERTICES) {
        throw new UploadRejected(`a region needs at least ${REGION_MIN_VERTICES} vertices, the file has ${vertices.length}`);
      }
      return vertices;
    },
  };
}
