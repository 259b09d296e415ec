import { z } from 'zod';

/** Outputs stored per point, by API name; each can sort, filter and colour a heatmap. */
export const POINT_OUTPUTS = ['ns', 'r', 'alphaS', 'As', 'amplitudeScale', 'nTotal', 'nStar', 'phiStar', 'phiEnd', 'energyScaleGeV'] as const;
export type PointOutput = (typeof POINT_OUTPUTS)[number];

const output = z.number().nullable();
export const scanPointSchema = z.object({
  pointIndex: z.number().int(),
  inputs: z.record(z.string(), z.number()),
  status: z.string(),
  failureReason: z.string().nullable(),
  ns: output,
  r: output,
  alphaS: output,
  As: output,
  amplitudeScale: output,
  nTotal: output,
  nStar: output,
  phiStar: output,
  phiEnd: output,
  energyScaleGeV: output,
});
export type ScanPointDto = z.infer<typeof scanPointSchema>;

const optionalNumber = z.coerce.number({ error: 'must be a number' }).optional();

/**
 * `GET /api/scans/:id/points`: paged and sorted, filtered by status and by ranges of any
 * output (`ns_min=0.96&ns_max=0.97`); `format=csv|json` streams every matching point instead.
 */
export const scanPointsQuerySchema = z
  .object({
    page: z.coerce.number().int().min(1, 'page starts at 1').default(1),
    pageSize: z.coerce.number().int().min(1).max(1000, 'pageSize is at most 1000').default(100),
    sort: z.enum(['pointIndex', ...POINT_OUTPUTS]).default('pointIndex'),
    order: z.enum(['asc', 'desc']).default('asc'),
    /** `ok`, `failed` (any failure) or one failure code. */
    status: z.string().max(32).optional(),
    format: z.enum(['csv', 'json']).optional(),
    ...Object.fromEntries(POINT_OUTPUTS.flatMap((k) => [[`${k}_min`, optionalNumber], [`${k}_max`, optionalNumber]])),
  })
  .transform((q) => {
    const ranges: { output: PointOutput; min?: number; max?: number }[] = [];
    const raw = q as Record<string, unknown>;
    for (const output of POINT_OUTPUTS) {
      const min = raw[`${output}_min`] as number | undefined;
      const max = raw[`${output}_max`] as number | undefined;
      if (min !== undefined || max !== undefined) ranges.push({ output, min, max });
    }
    return {
      page: q.page as number,
      pageSize: q.pageSize as number,
      sort: q.sort as 'pointIndex' | PointOutput,
      order: q.order as 'asc' | 'desc',
      status: q.status as string | undefined,
      format: q.format as 'csv' | 'json' | undefined,
      ranges,
    };
  });
export type ScanPointsQuery = z.output<typeof scanPointsQuerySchema>;

/** `GET /api/scans/:id/grid?x=f&y=nStar&output=ns&at.lambda=3`: a 2-D slice for a heatmap. */
export const scanGridQuerySchema = z.preprocess(
  // A query string arrives flat: gather `at.<parameter>` keys into one record.
  (raw) => {
    if (!raw || typeof raw !== 'object') return raw;
    const entries = Object.entries(raw as Record<string, unknown>);
    const at = Object.fromEntries(entries.filter(([k]) => k.startsWith('at.')).map(([k, v]) => [k.slice(3), v]));
    return { ...Object.fromEntries(entries.filter(([k]) => !k.startsWith('at.'))), at: { ...(raw as { at?: object }).at, ...at } };
  },
  z.object({
    x: z.string({ error: 'choose the x axis' }).min(1, 'choose the x axis'),
    y: z.string({ error: 'choose the y axis' }).min(1, 'choose the y axis'),
    output: z.enum([...POINT_OUTPUTS, 'status']).default('ns'),
    /** Index along each other axis, from `at.<parameter>=<index>` (default 0). */
    at: z.record(z.string(), z.coerce.number().int().min(0)).default({}),
  }),
);
export type ScanGridQuery = z.infer<typeof scanGridQuerySchema>;

const sliceAxis = z.object({ parameter: z.string(), values: z.array(z.number()) });

/** The slice: x and y axis values, and z[iy][ix] (null where the point failed or is not yet stored). */
export const scanGridSliceSchema = z.object({
  x: sliceAxis,
  y: sliceAxis,
  output: z.enum([...POINT_OUTPUTS, 'status']),
  z: z.array(z.array(z.number().nullable())),
  /** Each cell's point status, null where no point is stored yet. */
  status: z.array(z.array(z.string().nullable())),
  /** Where the slice cuts every other axis: its index and value there. */
  at: z.record(z.string(), z.object({ index: z.number().int(), value: z.number() })),
});
export type ScanGridSlice = z.infer<typeof scanGridSliceSchema>;
