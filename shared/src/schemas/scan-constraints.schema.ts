import { z } from 'zod';
import { likelihoodRefSchema, likelihoodSetEntrySchema } from './likelihood-set-entry.schema.js';

const PRIOR_KEY = /^prior\.([A-Za-z][A-Za-z0-9_]*)$/;

/**
 * `GET /api/scans/:id/constraints?likelihood=planck18-bk18&prior.alpha=log&x=alpha&y=nStar`: the
 * posterior of a grid scan under one likelihood set, with a prior per axis (default: uniform in the
 * logarithm of a log-spaced axis, uniform otherwise) and the pair of axes of the 2-D marginal
 * (default the first two). `format=csv` gives the 1-D marginals as CSV.
 */
export const scanConstraintsQuerySchema = z.preprocess(
  (raw) => {
    if (!raw || typeof raw !== 'object') return raw;
    const entries = Object.entries(raw as Record<string, unknown>);
    const priors = Object.fromEntries(entries.flatMap(([k, v]) => { const m = PRIOR_KEY.exec(k); return m ? [[m[1], v]] : []; }));
    return { ...Object.fromEntries(entries.filter(([k]) => !PRIOR_KEY.test(k))), priors };
  },
  z.object({
    likelihood: likelihoodRefSchema,
    priors: z.record(z.string(), z.enum(['uniform', 'log'], { error: 'a prior is uniform or log' })).default({}),
    x: z.string().optional(),
    y: z.string().optional(),
    format: z.enum(['json', 'csv']).default('json'),
  }),
);
export type ScanConstraintsQuery = z.output<typeof scanConstraintsQuerySchema>;

const interval = z.object({ level: z.number(), kind: z.enum(['two-sided', 'upper-limit', 'lower-limit']), lower: z.number(), upper: z.number() });

/** The answer: what the scan's data allow under the set, with the numbers it rests on. */
export const scanConstraintsSchema = z.object({
  scanId: z.number().int(),
  /** The set judged with, its version and sources (a result always names the version). */
  likelihood: likelihoodSetEntrySchema,
  priors: z.array(z.object({ axis: z.string(), prior: z.enum(['uniform', 'log']) })),
  marginals: z.array(z.object({ axis: z.string(), prior: z.enum(['uniform', 'log']), values: z.array(z.number()), mass: z.array(z.number()), density: z.array(z.number().nullable()) })),
  constraints: z.array(z.object({ axis: z.string(), intervals: z.array(interval), edgeWarning: z.string().nullable() })),
  pair: z
    .object({ x: z.string(), y: z.string(), xValues: z.array(z.number()), yValues: z.array(z.number()), density: z.array(z.number().nullable()), contourDensity: z.array(z.object({ level: z.number(), density: z.number() })) })
    .nullable(),
  bestFit: z.object({ pointIndex: z.number().int(), deltaChi2: z.number(), inputs: z.record(z.string(), z.number()) }).nullable(),
  /** Failed, flagged or not yet computed points: left out, never counted as zero likelihood. */
  excluded: z.object({ count: z.number().int(), priorFraction: z.number() }),
  included: z.number().int(),
  evidence: z.object({ z: z.number(), lnZ: z.number(), lnZHalf: z.number(), lnZError: z.number(), note: z.string() }).nullable(),
});
export type ScanConstraints = z.infer<typeof scanConstraintsSchema>;
