import { z } from 'zod';

/** `GET /api/scans/:id/plane?limit=20000`: at most `limit` OK points come back. */
export const scanPlaneQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(100_000).default(20_000),
});
export type ScanPlaneQuery = z.infer<typeof scanPlaneQuerySchema>;

/**
 * A scan's OK points as columns, for an n_s–r scatter plot: element i of every array is the
 * same point. With more points than `limit`, the scan is sampled evenly as a sub-grid (every
 * `axisStrides[a]`-th value of axis a, from the first; a point list is one axis, its order) and
 * the OK points among the sampled ones are returned.
 */
export const scanPlaneSchema = z.object({
  /** OK points stored so far. */
  okPoints: z.number().int(),
  /** 1 in `stride` points of the scan is sampled (the product of `axisStrides`); 1 = all. */
  stride: z.number().int(),
  /** The sampling step along each grid axis, in the order of `parameters`; for a point list, one step along the list. */
  axisStrides: z.array(z.number().int()),
  /** The scan's axis parameters, in axis order. */
  parameters: z.array(z.string()),
  pointIndex: z.array(z.number().int()),
  ns: z.array(z.number()),
  r: z.array(z.number()),
  alphaS: z.array(z.number()),
  nStar: z.array(z.number()),
  /** Each axis parameter's value at each point, aligned with pointIndex. */
  inputs: z.record(z.string(), z.array(z.number())),
});
export type ScanPlane = z.infer<typeof scanPlaneSchema>;
