import { z } from 'zod';

/** One published source of a likelihood set's numbers. */
export const likelihoodSourceSchema = z.object({
  label: z.string().trim().min(1, 'give the source a short label, e.g. "Planck 2018 X"').max(120, 'a source label has at most 120 characters'),
  citation: z.string().trim().min(1, 'give the full citation').max(500, 'a citation has at most 500 characters'),
  arxiv: z
    .string()
    .trim()
    .regex(/^(\d{4}\.\d{4,5}|[a-z-]+(\.[A-Z]{2})?\/\d{7})$/, 'give the arXiv id, e.g. 1807.06211 or astro-ph/0305263'),
});
export type LikelihoodSource = z.infer<typeof likelihoodSourceSchema>;

const gaussianSchema = (what: string) =>
  z.object({
    mean: z.number({ error: `give the mean of ${what}` }),
    sigma: z.number({ error: `give the 68% half-width of ${what}` }).positive(`the 68% half-width of ${what} must be positive`),
  });

/**
 * A named, versioned likelihood over (n_s, r), and α_s where the data set has it, built from
 * published numbers: a Gaussian in n_s, r from a published 95% upper limit through a half-Gaussian
 * in r ≥ 0 (σ_r = r95 / 1.96), an optional Gaussian in α_s. `statement` is shown wherever the set is
 * used: it approximates the published result and is not the published likelihood. A changed
 * number makes a new version, never an edit of an old one, so results keep the version they were judged with.
 */
export const likelihoodSetSchema = z.object({
  key: z
    .string({ error: 'give the set a key' })
    .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'the key uses lower-case letters, digits and single hyphens, e.g. planck18-bk18')
    .max(64, 'a key has at most 64 characters'),
  version: z.number({ error: 'give the version' }).int('the version is a whole number').min(1, 'versions start at 1'),
  name: z.string({ error: 'give the set a name' }).trim().min(1, 'give the set a name').max(120, 'a name has at most 120 characters'),
  statement: z
    .string({ error: 'say on screen what the set approximates' })
    .trim()
    .min(1, 'say on screen what the set approximates')
    .max(1000, 'the statement has at most 1000 characters'),
  sources: z.array(likelihoodSourceSchema).min(1, 'name at least one source'),
  ns: gaussianSchema('n_s'),
  r: z.object({
    upper95: z.number({ error: 'give the 95% upper limit on r' }).positive('the 95% upper limit on r must be positive'),
    pivotPerMpc: z.number({ error: 'give the pivot k of the r limit, in Mpc⁻¹' }).positive('the pivot k must be positive'),
  }),
  alphaS: gaussianSchema('α_s').optional(),
});
export type LikelihoodSet = z.infer<typeof likelihoodSetSchema>;
