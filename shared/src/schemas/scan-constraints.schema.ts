import { z } from 'zod';
import { judgedLikelihoodSchema, likelihoodRefSchema } from './likelihood-set-entry.schema.js';

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
  /** The set judged with, its version and sources (a result always names the version), or the uploaded regions. */
  likelihood: judgedLikelihoodSchema,
  priors: z.array(z.object({ axis: z.string(), prior: z.enum(['uniform', 'log']) })),
  marginals: z.array(z.object({ axis: z.string(), prior: z.enum(['uniform', 'log']), values: z.array(z.number()), mass: z.array(z.number()), density: z.array(z.number().nullable()) })),
  constraints: z.array(z.object({ axis: z.string(), intervals: z.array(interval), edgeWarning: z.string().nullable() })),
  pair: z
    .object({ x: z.string(), y: z.string(), xValues: z.array(z.number()), yValues: z.array(z.number()), density: z.array(z.number().nullable()), contourDensity: z.array(z.object({ level: z.number(), density: z.number() })) })
    .nullable(),
  /** `scanId` names the scan holding the point when the posterior is merged from refinement levels. */
  bestFit: z.object({ pointIndex: z.number().int(), scanId: z.number().int().optional(), deltaChi2: z.number(), inputs: z.record(z.string(), z.number()) }).nullable(),
  /** Failed, flagged or not yet computed points: left out, never counted as zero likelihood. */
  excluded: z.object({ count: z.number().int(), priorFraction: z.number() }),
  included: z.number().int(),
  evidence: z.object({ z: z.number(), lnZ: z.number(), lnZHalf: z.number(), lnZError: z.number(), note: z.string() }).nullable(),
  /**
   * Present when the answer is merged from a refinement chain (see DEVELOPERS.md, "Refinement"): the
   * parent grid, the levels merged, their points, and the level whose nodes the marginals are stated on.
   */
  refinement: z.object({ parentScanId: z.number().int(), levelScanIds: z.array(z.number().int()), points: z.number().int(), marginalLevel: z.number().int() }).optional(),
});
export type ScanConstraints = z.infer<typeof scanConstraintsSchema>;

/**
 * A comma-separated list of likelihood references: a bare id after `regions:<id>` continues that
 * reference, so `planck18-bk18,regions:12,13` is two likelihoods.
 */
function splitLikelihoods(list: string): string[] {
  const refs: string[] = [];
  for (const item of list.split(',').map((x) => x.trim())) {
    if (/^\d+$/.test(item) && refs.at(-1)?.startsWith('regions:')) refs[refs.length - 1] += `,${item}`;
    else refs.push(item);
  }
  return refs;
}

/**
 * `GET /api/scans/evidence?ids=3,5,8&likelihoods=planck18-bk18,pact-lb-bk18&reference=3`: the evidence of
 * each grid scan under each set, and ln B against the reference scan (default the first), ranked.
 */
export const evidenceComparisonQuerySchema = z
  .object({
    ids: z
      .string({ error: 'list the scans, e.g. ids=3,5' })
      .transform((s) => s.split(',').map((x) => Number(x.trim())))
      .pipe(z.array(z.number().int('scan ids are whole numbers').positive('scan ids are positive')).min(1, 'list at least one scan').max(8, 'compare at most 8 scans')),
    likelihoods: z
      .string()
      .default('planck18-bk18,pact-lb-bk18')
      .transform(splitLikelihoods)
      .pipe(z.array(likelihoodRefSchema).min(1, 'name at least one likelihood set').max(6, 'at most 6 likelihood sets'))
      .describe('Comma-separated likelihoods: sets as `key` or `key@version`, and uploaded constraint regions as `regions:<id>,<id>`'),
    reference: z.coerce.number({ error: 'must be a scan id' }).int().positive().optional(),
  })
  .refine((q) => q.reference === undefined || q.ids.includes(q.reference), { path: ['reference'], message: 'the reference must be one of the scans compared' });
export type EvidenceComparisonQuery = z.output<typeof evidenceComparisonQuerySchema>;

export const evidenceComparisonSchema = z.object({
  referenceId: z.number().int(),
  /** Shown beside every table: the evidence depends on the prior ranges the scans chose. */
  note: z.string(),
  sets: z.array(
    z.object({
      likelihood: judgedLikelihoodSchema,
      /** Best first (highest ln Z); a scan with no judged point has lnZ null and comes last. */
      scans: z.array(
        z.object({
          scanId: z.number().int(),
          name: z.string(),
          rank: z.number().int(),
          lnZ: z.number().nullable(),
          lnZError: z.number().nullable(),
          included: z.number().int(),
          excluded: z.number().int(),
          /** Against the reference scan: ln B, 2 ln B and the words of Kass & Raftery (1995). */
          lnB: z.number().nullable(),
          twoLnB: z.number().nullable(),
          verdict: z.string().nullable(),
        }),
      ),
    }),
  ),
});
export type EvidenceComparison = z.infer<typeof evidenceComparisonSchema>;
