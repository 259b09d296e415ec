import { likelihoodSetSchema, type LikelihoodSet, type LikelihoodSource } from '../schemas/likelihood-set.schema.js';

const APPROXIMATION =
  'An approximation of the published result, not the published likelihood: a Gaussian in n_s with the published ' +
  'mean and 68% width, and a half-Gaussian in r ≥ 0 whose width σ_r = r95/1.96 puts the published 95% upper limit ' +
  'at 1.96σ; correlations between the parameters are ignored.';

const PLANCK_2018_X: LikelihoodSource = {
  label: 'Planck 2018 X',
  citation: 'Planck Collaboration (Akrami et al.), "Planck 2018 results. X. Constraints on inflation", A&A 641, A10 (2020)',
  arxiv: '1807.06211',
};
const BICEP_KECK_2018: LikelihoodSource = {
  label: 'BICEP/Keck 2018',
  citation:
    'BICEP/Keck Collaboration, "Improved Constraints on Primordial Gravitational Waves using Planck, WMAP, and BICEP/Keck Observations through the 2018 Observing Season", PRL 127, 151301 (2021)',
  arxiv: '2110.00483',
};
const ACT_DR6: LikelihoodSource = {
  label: 'ACT DR6 (P-ACT-LB)',
  citation:
    'Louis et al., "The Atacama Cosmology Telescope: DR6 Power Spectra, Likelihoods and ΛCDM Parameters" (2025); n_s from the abstract, ACT + Planck + CMB lensing + DESI DR1 BAO',
  arxiv: '2503.14452',
};

/** The built-in sets, version 1 each. A changed number is added as version 2, the old entry stays. */
export const BUILT_IN_LIKELIHOOD_SETS: readonly LikelihoodSet[] = [
  {
    key: 'planck18',
    version: 1,
    name: 'Planck 2018 alone',
    statement: `${APPROXIMATION} α_s is a Gaussian with the published mean and width.`,
    sources: [PLANCK_2018_X],
    // n_s: Planck 2018 X abstract (TT,TE,EE+lowE+lensing, 68%). r_0.002 < 0.10 (95%): Planck 2018 X
    // abstract, from memory. α_s = −0.0045 ± 0.0067 (ΛCDM + running): Planck 2018 X, from memory
    // (the Planck 2018 I scorecard prints −0.0042 ± 0.0067).
    ns: { mean: 0.9649, sigma: 0.0042 },
    r: { upper95: 0.1, pivotPerMpc: 0.002 },
    alphaS: { mean: -0.0045, sigma: 0.0067 },
  },
  {
    key: 'planck18-bk18',
    version: 1,
    name: 'Planck 2018 + BICEP/Keck 2018',
    statement: `${APPROXIMATION} n_s is Planck 2018's; r is BICEP/Keck 2018's limit.`,
    sources: [PLANCK_2018_X, BICEP_KECK_2018],
    // n_s: Planck 2018 X abstract. r_0.05 < 0.036 (95%): BICEP/Keck 2018 abstract (arXiv:2110.00483).
    ns: { mean: 0.9649, sigma: 0.0042 },
    r: { upper95: 0.036, pivotPerMpc: 0.05 },
  },
  {
    key: 'pact-lb-bk18',
    version: 1,
    name: 'P-ACT-LB + BICEP/Keck 2018',
    statement: `${APPROXIMATION} n_s is the ACT DR6 P-ACT-LB value; r is BICEP/Keck 2018's limit.`,
    sources: [ACT_DR6, BICEP_KECK_2018],
    // n_s = 0.974 ± 0.003 (68%): Louis et al. 2025 abstract (arXiv:2503.14452).
    // r_0.05 < 0.036 (95%): BICEP/Keck 2018 abstract (arXiv:2110.00483).
    ns: { mean: 0.974, sigma: 0.003 },
    r: { upper95: 0.036, pivotPerMpc: 0.05 },
  },
].map((set) => Object.freeze(likelihoodSetSchema.parse(set)));

/** The latest version of a built-in set, or undefined for an unknown key. */
export function findLikelihoodSet(key: string, version?: number): LikelihoodSet | undefined {
  const matching = BUILT_IN_LIKELIHOOD_SETS.filter((set) => set.key === key && (version === undefined || set.version === version));
  return matching.reduce<LikelihoodSet | undefined>((latest, set) => (latest && latest.version > set.version ? latest : set), undefined);
}
