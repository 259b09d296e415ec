import { z } from 'zod';
import { pageOf } from './admin.schema.js';
import { POINT_OUTPUTS, scanPointSchema } from './scan-point.schema.js';

/** At most this many refinement levels after the parent grid. */
export const REFINEMENT_MAX_DEPTH = 4;

/**
 * Where a refinement looks: a likelihood's 68 or 95 % region (Δχ² = 2.30 or 6.18 in the n_s–r plane,
 * from the set's stored n_s, r, α_s), or a level of a stored output (n_s = 0.965, r = 0.036).
 */
export const refinementBoundarySchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('likelihood'),
    /** A built-in or admin likelihood set, `key` or `key@version`. */
    likelihood: z.string().trim().min(1, 'name a likelihood set').max(80),
    level: z.union([z.literal(68), z.literal(95)], { error: 'the level is 68 or 95 (%)' }),
  }),
  z.object({
    kind: z.literal('output'),
    output: z.enum(POINT_OUTPUTS, { error: `the output is one of ${POINT_OUTPUTS.join(', ')}` }),
    value: z.number({ error: 'the level must be a finite number' }),
  }),
]);
export type RefinementBoundary = z.infer<typeof refinementBoundarySchema>;

/** `POST /api/scans/:id/refine` (and, as a query, its estimate): the boundary, a factor per axis, the depth. */
export const refineScanSchema = z.object({
  boundary: refinementBoundarySchema,
  /** Factor per axis parameter: 2 to 4, or 1 for an axis kept whole; an axis not named is split by 2. */
  factors: z.record(z.string(), z.number().int('a factor is a whole number').min(1, 'a factor is at least 1').max(4, 'a factor is at most 4')).default({}),
  depth: z.number().int('the depth is a whole number').min(1, 'the depth is at least 1').max(REFINEMENT_MAX_DEPTH, `the depth is at most ${REFINEMENT_MAX_DEPTH}`).default(2),
});
export type RefineScan = z.infer<typeof refineScanSchema>;
export type RefineScanInput = z.input<typeof refineScanSchema>;

/** The estimate's query fields as documented (`factor.<axis>` besides): the boundary flattened into the query string. */
export const refineEstimateQueryFieldsSchema = z.object({
  boundary: z.enum(['likelihood', 'output']).describe('what the boundary is: a likelihood region or an output level'),
  likelihood: z.string().optional().describe('with boundary=likelihood: the set, key or key@version'),
  level: z.string().optional().describe('with boundary=likelihood: 68 or 95'),
  output: z.string().optional().describe('with boundary=output: the output, e.g. ns'),
  value: z.string().optional().describe('with boundary=output: its level, e.g. 0.965'),
  depth: z.string().optional().describe('levels after the parent, 1 to 4 (default 2)'),
});

/**
 * The estimate's query read as a request: `boundary=likelihood&likelihood=planck18-bk18&level=95`
 * or `boundary=output&output=ns&value=0.965`, `factor.<axis>=2`, `depth=3`.
 */
export const refineEstimateQuerySchema = z.preprocess((raw) => {
  if (!raw || typeof raw !== 'object') return raw;
  const q = raw as Record<string, unknown>;
  const num = (v: unknown) => (typeof v === 'string' && v.trim() !== '' && Number.isFinite(Number(v)) ? Number(v) : v);
  const factors = Object.fromEntries(Object.entries(q).filter(([k]) => k.startsWith('factor.')).map(([k, v]) => [k.slice('factor.'.length), num(v)]));
  const boundary = q.boundary === 'output' ? { kind: 'output', output: q.output, value: num(q.value) } : { kind: q.boundary, likelihood: q.likelihood, level: num(q.level) };
  return { boundary, factors, depth: q.depth === undefined ? undefined : num(q.depth) };
}, refineScanSchema);

/** What is stored with each follow-up scan: where it sits in its chain. */
export const scanRefinementSchema = z.object({
  /** The grid scan the chain refines (level 0). */
  parentScanId: z.number().int().positive(),
  boundary: refinementBoundarySchema,
  /** Per parent axis, in its order. */
  factors: z.array(z.number().int().min(1).max(4)),
  depth: z.number().int().min(1).max(REFINEMENT_MAX_DEPTH),
  level: z.number().int().min(1).max(REFINEMENT_MAX_DEPTH),
  /** The cells of level − 1 this level splits, by lowest corner in that level's coordinates. */
  cells: z.array(z.array(z.number().int().nonnegative())),
  /** Lattice coordinates (of this level) of each point, in the point list's row order. */
  lattice: z.array(z.array(z.number().int().nonnegative())),
});
export type ScanRefinement = z.infer<typeof scanRefinementSchema>;

/** The answer to the estimate: the first level's points and how long they should take. */
export const refinementEstimateSchema = z.object({
  level: z.literal(1),
  cells: z.number().int(),
  crossedCells: z.number().int(),
  points: z.number().int(),
  parentPoints: z.number().int(),
  /** Points per second the parent was computed at (its points over its run time); null when unknown. */
  pointsPerSecond: z.number().nullable(),
  seconds: z.number().nullable(),
  /** Nodes per axis of the finest level the depth allows. */
  finestLengths: z.array(z.number().int()),
});
export type RefinementEstimate = z.infer<typeof refinementEstimateSchema>;

/** A scan's place in refinement chains: the levels refining it, or the chain it belongs to. */
export const scanLineageSchema = z.object({
  /** Set on a follow-up level: its parent grid scan and level. */
  parentScanId: z.number().int().nullable(),
  level: z.number().int().nullable(),
  /** Every level of every chain on the parent (this scan's parent, or this scan), in order. */
  levels: z.array(z.object({ scanId: z.number().int(), level: z.number().int(), name: z.string(), status: z.string(), totalPoints: z.number().int() })),
  /** A level has finished and the API has yet to decide on the next (within one reconcile interval): the chain may still grow. */
  chaining: z.boolean(),
});
export type ScanLineage = z.infer<typeof scanLineageSchema>;

/** A point of a refined grid's merged table: the scan that holds it and its level (0: the parent grid). */
export const refinedPointSchema = scanPointSchema.extend({ scanId: z.number().int(), level: z.number().int() });
export type RefinedPoint = z.infer<typeof refinedPointSchema>;

/**
 * One page of every level's points, by default the parent's first, each scan's by point index;
 * `judgedBy` as on a scan's page of points.
 */
export const refinedPointPageSchema = pageOf(refinedPointSchema).extend({
  judgedBy: z.string().optional(),
  parentScanId: z.number().int(),
  levelScanIds: z.array(z.number().int()),
});
export type RefinedPointPage = z.infer<typeof refinedPointPageSchema>;
