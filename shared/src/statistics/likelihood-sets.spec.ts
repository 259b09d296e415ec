import { describe, expect, it } from 'vitest';
import { likelihoodSetSchema } from '../schemas/likelihood-set.schema.js';
import { BUILT_IN_LIKELIHOOD_SETS, findLikelihoodSet } from './likelihood-sets.js';

describe('built-in likelihood sets', () => {
  it('hold the published numbers with their sources', () => {
    const planck = findLikelihoodSet('planck18')!;
    // Planck 2018 X (arXiv:1807.06211): n_s = 0.9649 ± 0.0042; r_0.002 < 0.10 and α_s = −0.0045 ± 0.0067 from memory.
    expect(planck).toMatchObject({ version: 1, ns: { mean: 0.9649, sigma: 0.0042 }, r: { upper95: 0.1, pivotPerMpc: 0.002 }, alphaS: { mean: -0.0045, sigma: 0.0067 } });
    // BICEP/Keck 2018 (arXiv:2110.00483): r_0.05 < 0.036.
    expect(findLikelihoodSet('planck18-bk18')).toMatchObject({ ns: { mean: 0.9649, sigma: 0.0042 }, r: { upper95: 0.036, pivotPerMpc: 0.05 } });
    expect(findLikelihoodSet('planck18-bk18')!.alphaS).toBeUndefined();
    // Louis et al. 2025 (arXiv:2503.14452) abstract: n_s = 0.974 ± 0.003 for P-ACT-LB.
    expect(findLikelihoodSet('pact-lb-bk18')).toMatchObject({ ns: { mean: 0.974, sigma: 0.003 }, r: { upper95: 0.036, pivotPerMpc: 0.05 } });
    expect(findLikelihoodSet('pact-lb-bk18')!.sources.map((s) => s.arxiv)).toEqual(['2503.14452', '2110.00483']);
  });

  it('each says it approximates the published result and is not the published likelihood', () => {
    for (const set of BUILT_IN_LIKELIHOOD_SETS) {
      expect(set.statement).toContain('not the published likelihood');
      expect(likelihoodSetSchema.parse(set)).toEqual(set);
    }
  });

  it('finds a version, and nothing for an unknown key', () => {
    expect(findLikelihoodSet('planck18', 1)?.version).toBe(1);
    expect(findLikelihoodSet('planck18', 2)).toBeUndefined();
    expect(findLikelihoodSet('wmap9')).toBeUndefined();
  });
});

describe('likelihoodSetSchema', () => {
  const valid = { ...findLikelihoodSet('pact-lb-bk18')!, key: 'group-set', version: 1 };

  it('names the field of a bad input', () => {
    const issues = (input: unknown) => likelihoodSetSchema.safeParse(input).error?.issues.map((i) => [i.path.join('.'), i.message]);
    expect(issues({ ...valid, key: 'Planck 2018' })).toEqual([['key', expect.stringContaining('lower-case')]]);
    expect(issues({ ...valid, version: 0 })).toEqual([['version', 'versions start at 1']]);
    expect(issues({ ...valid, ns: { mean: 0.97, sigma: 0 } })).toEqual([['ns.sigma', 'the 68% half-width of n_s must be positive']]);
    expect(issues({ ...valid, r: { upper95: -0.1, pivotPerMpc: 0.05 } })).toEqual([['r.upper95', 'the 95% upper limit on r must be positive']]);
    expect(issues({ ...valid, sources: [] })).toEqual([['sources', 'name at least one source']]);
    expect(issues({ ...valid, sources: [{ label: 'x', citation: 'y', arxiv: 'soon' }] })).toEqual([['sources.0.arxiv', expect.stringContaining('arXiv id')]]);
    expect(issues({ ...valid, statement: ' ' })).toEqual([['statement', 'say on screen what the set approximates']]);
    expect(issues(valid)).toBeUndefined();
  });
});
