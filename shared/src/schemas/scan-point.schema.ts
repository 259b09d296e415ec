import { z } from 'zod';
import { pageOf } from './admin.schema.js';
import { likelihoodRefSchema } from './likelihood-set-entry.schema.js';

/**
 * Why Δχ² cannot sort, filter or colour a heatmap under uploaded regions: those run in SQL, and a
 * region likelihood (point-in-polygon and distances to the contours) is evaluated per point in the API.
 */
export const REGION_LIKELIHOOD_NOT_IN_SQL =
  'needs a published or admin likelihood set: a region likelihood is evaluated per point outside the database';

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
  /** With `likelihood=<set>`: −2 ln(L/L_max) under that set (null for a failed point), and the confidence level it corresponds to. */
  deltaChi2: output.optional(),
  confidence: output.optional(),
  /** With `likelihood=regions:…`: the point lies outside the outermost contour, where Δχ² is extrapolated (null for a failed point). */
  outsideRegions: z.boolean().nullable().optional(),
});
export type ScanPointDto = z.infer<typeof scanPointSchema>;

/**
 * A page of points. `judgedBy` names the likelihood the Δχ² columns were computed with, version
 * included (`planck18-bk18@1`, `regions:4,5`), so an answer says what judged it even when the
 * query named a set without its version.
 */
export const scanPointPageSchema = pageOf(scanPointSchema).extend({ judgedBy: z.string().optional() });
export type ScanPointPage = z.infer<typeof scanPointPageSchema>;

/** Download formats of the points: CSV, a JSON array, or an Apache Arrow IPC stream (columnar). */
export const POINT_EXPORT_FORMATS = ['csv', 'json', 'arrow'] as const;
export type PointExportFormat = (typeof POINT_EXPORT_FORMATS)[number];

const optionalNumber = z.coerce.number({ error: 'must be a number' }).optional();

/** A point column to sort or filter by: the index, an output, Δχ² under the asked likelihood set, or an input as `input.<axis parameter>`. */
export type PointSortKey = 'pointIndex' | PointOutput | 'deltaChi2' | `input.${string}`;

const INPUT_KEY = /^input\.([A-Za-z][A-Za-z0-9_]*)$/;
const INPUT_RANGE_KEY = /^input\.([A-Za-z][A-Za-z0-9_]*)_(min|max)$/;

/** The input a sort key names, or null for the index and the outputs. */
export function sortedInput(sort: PointSortKey): string | null {
  return INPUT_KEY.exec(sort)?.[1] ?? null;
}

/** The named query fields of the points route, as documented; input ranges come as `input.<name>_min|max`. */
export const scanPointsQueryFieldsSchema = z.object({
  page: z.coerce.number().int().min(1, 'page starts at 1').default(1),
  pageSize: z.coerce.number().int().min(1).max(1000, 'pageSize is at most 1000').default(100),
  sort: z
    .string()
    .default('pointIndex')
    .refine((s) => s === 'pointIndex' || s === 'deltaChi2' || (POINT_OUTPUTS as readonly string[]).includes(s) || INPUT_KEY.test(s), {
      message: `sort by pointIndex, an output (${POINT_OUTPUTS.join(', ')}), deltaChi2 (with likelihood) or input.<axis parameter>`,
    }),
  /** A likelihood set (`key` or `key@version`) or uploaded regions (`regions:<id>,<id>`): each point then carries its Δχ² and confidence level under it. */
  likelihood: likelihoodRefSchema.optional(),
  deltaChi2_max: optionalNumber,
  order: z.enum(['asc', 'desc']).default('asc'),
  /** `ok`, `failed` (any failure) or one failure code. */
  status: z.string().max(32).optional(),
  format: z.enum(POINT_EXPORT_FORMATS).optional(),
  ...Object.fromEntries(POINT_OUTPUTS.flatMap((k) => [[`${k}_min`, optionalNumber], [`${k}_max`, optionalNumber]])),
});

/** Gathers flat `input.<name>_min|max` keys of a query string into `inputRanges`. */
function gatherInputRanges(raw: unknown): unknown {
  if (!raw || typeof raw !== 'object') return raw;
  const ranges = new Map<string, { name: string; min?: unknown; max?: unknown }>();
  const rest: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
    const match = INPUT_RANGE_KEY.exec(key);
    if (!match) {
      rest[key] = value;
      continue;
    }
    const range = ranges.get(match[1]) ?? { name: match[1] };
    range[match[2] as 'min' | 'max'] = value;
    ranges.set(match[1], range);
  }
  return { ...rest, inputRanges: [...ranges.values()] };
}

/**
 * `GET /api/scans/:id/points`: paged and sorted by any column, filtered by status and by ranges of
 * any output (`ns_min=0.96&ns_max=0.97`) or axis input (`input.lambda_min=1e-12`); `format=csv|json|arrow`
 * streams every matching point instead.
 */
export const scanPointsQuerySchema = z.preprocess(
  gatherInputRanges,
  scanPointsQueryFieldsSchema
    .extend({
      inputRanges: z.array(z.object({ name: z.string(), min: optionalNumber, max: optionalNumber })).max(8, 'at most 8 input filters').default([]),
    })
    .superRefine((q, ctx) => {
      if (q.likelihood?.kind === 'regions') {
        if (q.sort === 'deltaChi2') ctx.addIssue({ code: 'custom', path: ['sort'], message: `sorting by deltaChi2 ${REGION_LIKELIHOOD_NOT_IN_SQL}` });
        if (q.deltaChi2_max !== undefined) ctx.addIssue({ code: 'custom', path: ['deltaChi2_max'], message: `deltaChi2_max ${REGION_LIKELIHOOD_NOT_IN_SQL}` });
      }
      if (q.likelihood) return;
      const needs = 'name the likelihood set too, e.g. likelihood=planck18-bk18';
      if (q.sort === 'deltaChi2') ctx.addIssue({ code: 'custom', path: ['sort'], message: `sorting by deltaChi2: ${needs}` });
      if (q.deltaChi2_max !== undefined) ctx.addIssue({ code: 'custom', path: ['deltaChi2_max'], message: needs });
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
        page: q.page,
        pageSize: q.pageSize,
        sort: q.sort as PointSortKey,
        order: q.order,
        status: q.status,
        format: q.format,
        ranges,
        /** Ranges of axis parameters; the API checks the names against the scan's axes. */
        inputRanges: q.inputRanges as { name: string; min?: number; max?: number }[],
        likelihood: q.likelihood,
        deltaChi2Max: q.deltaChi2_max,
      };
    }),
);
export type ScanPointsQuery = z.output<typeof scanPointsQuerySchema>;

/** Most cells along each axis of a heatmap slice: a larger slice comes aggregated in blocks. */
export const GRID_MAX_CELLS = 512;

const windowEnd = z.coerce.number({ error: 'must be a whole number' }).int('must be a whole number').min(0, 'is an axis index, 0 or more').optional();

/** The named query fields of the grid route, as documented; the cut along other axes comes as `at.<parameter>=<index>`. */
export const scanGridQueryFieldsSchema = z.object({
  x: z.string({ error: 'choose the x axis' }).min(1, 'choose the x axis'),
  y: z.string({ error: 'choose the y axis' }).min(1, 'choose the y axis'),
  /** An output, the status, or `deltaChi2` under the `likelihood` set (for the 68/95 % boundary lines). */
  output: z.enum([...POINT_OUTPUTS, 'status', 'deltaChi2']).default('ns'),
  likelihood: likelihoodRefSchema.optional(),
  maxCells: z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'is at least 1').max(GRID_MAX_CELLS, `is at most ${GRID_MAX_CELLS}`).default(GRID_MAX_CELLS),
  xFrom: windowEnd,
  xTo: windowEnd,
  yFrom: windowEnd,
  yTo: windowEnd,
});

/**
 * `GET /api/scans/:id/grid?x=f&y=nStar&output=ns&at.lambda=3`: a 2-D slice for a heatmap, at most
 * `maxCells` cells along each axis; `xFrom`..`xTo` and `yFrom`..`yTo` (axis indices, inclusive) zoom in.
 */
export const scanGridQuerySchema = z.preprocess(
  // A query string arrives flat: gather `at.<parameter>` keys into one record.
  (raw) => {
    if (!raw || typeof raw !== 'object') return raw;
    const entries = Object.entries(raw as Record<string, unknown>);
    const at = Object.fromEntries(entries.filter(([k]) => k.startsWith('at.')).map(([k, v]) => [k.slice(3), v]));
    return { ...Object.fromEntries(entries.filter(([k]) => !k.startsWith('at.'))), at: { ...(raw as { at?: object }).at, ...at } };
  },
  scanGridQueryFieldsSchema
    .extend({
      /** Index along each other axis, from `at.<parameter>=<index>` (default 0). */
      at: z.record(z.string(), z.coerce.number().int().min(0)).default({}),
    })
    .superRefine((q, ctx) => {
      for (const axis of ['x', 'y'] as const) {
        const from = q[`${axis}From`];
        const to = q[`${axis}To`];
        if (from !== undefined && to !== undefined && from > to) ctx.addIssue({ code: 'custom', path: [`${axis}To`], message: `must not be below ${axis}From` });
      }
      if (q.output === 'deltaChi2' && q.likelihood?.kind === 'regions') ctx.addIssue({ code: 'custom', path: ['output'], message: `output=deltaChi2 ${REGION_LIKELIHOOD_NOT_IN_SQL}` });
      if (q.output === 'deltaChi2' && !q.likelihood) ctx.addIssue({ code: 'custom', path: ['likelihood'], message: 'output=deltaChi2: name the likelihood set too, e.g. likelihood=planck18-bk18' });
    }),
);
export type ScanGridQuery = z.infer<typeof scanGridQuerySchema>;

const sliceAxis = z.object({
  parameter: z.string(),
  /** Values of the whole axis in the scan. */
  length: z.number().int(),
  /** The window along the axis: axis indices `from` to `to`, inclusive. */
  from: z.number().int(),
  to: z.number().int(),
  /** Axis indices per cell: cell i covers from + i·block up to block indices (fewer in the last cell). */
  block: z.number().int(),
  /** The axis value at each cell's first index. */
  values: z.array(z.number()),
});
export type ScanGridSliceAxis = z.infer<typeof sliceAxis>;

/**
 * Significant digits of a slice's means, minima and maxima: one more than the page shows (6), and
 * far fewer bytes than a double's 17. Counts are exact.
 */
export const SLICE_SIGNIFICANT_DIGITS = 7;
export const roundForSlice = (value: number) => Number(value.toPrecision(SLICE_SIGNIFICANT_DIGITS));

/**
 * One number per cell, row-major (cell (ix, iy) at iy · x.values.length + ix), null where a cell has
 * no OK point; rounded to SLICE_SIGNIFICANT_DIGITS.
 */
const cellColumn = z.array(z.number().nullable());
const countColumn = z.array(z.number().int());

/**
 * A slice of at most GRID_MAX_CELLS² cells as columns. A cell is one point, or a block of
 * x.block × y.block points: the mean, min and max of the output over its OK points (to 7 significant
 * digits, SLICE_SIGNIFICANT_DIGITS), and its exact counts of OK points and of failed points by
 * reason. Points neither counted are not stored yet.
 */
export const scanGridSliceSchema = z.object({
  x: sliceAxis,
  y: sliceAxis,
  output: z.enum([...POINT_OUTPUTS, 'status', 'deltaChi2']),
  /** Absent for the status output. */
  mean: cellColumn.optional(),
  /** Absent where they would repeat the mean: for the status output and when each cell is one point. */
  min: cellColumn.optional(),
  max: cellColumn.optional(),
  ok: countColumn,
  /** Failed points per cell, one column per failure code present in the slice. */
  failed: z.record(z.string(), countColumn),
  /** Where the slice cuts every other axis: its index and value there. */
  at: z.record(z.string(), z.object({ index: z.number().int(), value: z.number() })),
  /**
   * A refined two-axis grid (see DEVELOPERS.md, "Refinement"): the leaves of its chain's levels in the
   * window, to draw over the parent's cells, finer over coarser. A cell's `x`, `y` are its corners on
   * the finest lattice, where parent index i is i · scale; `corners` are the output's values at its
   * four corners (x lower/upper fastest, then y; null where failed), and `failure` names a failed
   * corner's reason. Absent without refinement; Δχ² slices carry it too, for boundary lines.
   */
  refined: z
    .object({
      scale: z.tuple([z.number().int(), z.number().int()]),
      cells: z.array(
        z.object({
          level: z.number().int(),
          x: z.tuple([z.number().int(), z.number().int()]),
          y: z.tuple([z.number().int(), z.number().int()]),
          corners: z.tuple([z.number().nullable(), z.number().nullable(), z.number().nullable(), z.number().nullable()]),
          failure: z.string().nullable(),
        }),
      ),
    })
    .optional(),
});
export type ScanGridSlice = z.infer<typeof scanGridSliceSchema>;
