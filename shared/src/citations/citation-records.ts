/**
 * The published works a scan's results rest on, as structured records (one per work, keyed as in
 * a .bib file). Only fields we are sure of are given. Where the repository names a work only by
 * authors, year and journal (the families' `reference`, the engine's comments), the title and any
 * journal details not written there are recalled: those records say "from memory" beside them.
 */
export interface CitationRecord {
  key: string;
  type: 'article' | 'misc' | 'software';
  /** Persons as "Last, First"; a name without a comma is a collaboration, written as one name; "others" ends a cut list. */
  authors: string[];
  title: string;
  journal?: string;
  volume?: string;
  pages?: string;
  year?: number;
  /** arXiv id, new (1807.06211) or old (astro-ph/0305263) style. */
  eprint?: string;
  version?: string;
  note?: string;
}

const article = (record: Omit<CitationRecord, 'type'>): CitationRecord => ({ type: 'article', ...record });

export const CITATIONS = {
  // From memory: the title and given names; authors, journal and year from the family's reference.
  linde1983: article({ key: 'linde1983', authors: ['Linde, A. D.'], title: 'Chaotic Inflation', journal: 'Phys. Lett. B', volume: '129', pages: '177', year: 1983 }),
  // From memory: the title and given names.
  starobinsky1980: article({
    key: 'starobinsky1980', authors: ['Starobinsky, A. A.'], title: 'A New Type of Isotropic Cosmological Models Without Singularity',
    journal: 'Phys. Lett. B', volume: '91', pages: '99', year: 1980,
  }),
  // From memory: the title and given names.
  freese1990: article({
    key: 'freese1990', authors: ['Freese, Katherine', 'Frieman, Joshua A.', 'Olinto, Angela V.'], title: 'Natural inflation with pseudo Nambu-Goldstone bosons',
    journal: 'Phys. Rev. Lett.', volume: '65', pages: '3233', year: 1990,
  }),
  // From memory: the title and given names.
  boubekeur2005: article({
    key: 'boubekeur2005', authors: ['Boubekeur, Lotfi', 'Lyth, David H.'], title: 'Hilltop inflation', journal: 'JCAP', volume: '07', pages: '010', year: 2005,
    eprint: 'hep-ph/0502047',
  }),
  // From memory: the title and given names; no journal given (the reference names only the arXiv id).
  kohri2007: { key: 'kohri2007', type: 'misc', authors: ['Kohri, Kazunori', 'Lin, Chia-Min', 'Lyth, David H.'], title: 'More hilltop inflation models', year: 2007, eprint: '0707.3826' },
  // From memory: the title and given names.
  kallosh2013conformal: article({
    key: 'kallosh2013conformal', authors: ['Kallosh, Renata', 'Linde, Andrei'], title: 'Universality Class in Conformal Inflation', journal: 'JCAP', volume: '07', pages: '002',
    year: 2013, eprint: '1306.5220',
  }),
  // From memory: the title and given names.
  kallosh2013attractors: article({
    key: 'kallosh2013attractors', authors: ['Kallosh, Renata', 'Linde, Andrei', 'Roest, Diederik'], title: 'Superconformal Inflationary α-Attractors', journal: 'JHEP',
    volume: '11', pages: '198', year: 2013, eprint: '1311.0472',
  }),
  // From memory: the title and given names.
  lucchin1985: article({ key: 'lucchin1985', authors: ['Lucchin, F.', 'Matarrese, S.'], title: 'Power-law inflation', journal: 'Phys. Rev. D', volume: '32', pages: '1316', year: 1985 }),
  // From memory: the title and given names.
  mcallister2010: article({
    key: 'mcallister2010', authors: ['McAllister, Liam', 'Silverstein, Eva', 'Westphal, Alexander'], title: 'Gravity Waves and Linear Inflation from Axion Monodromy',
    journal: 'Phys. Rev. D', volume: '82', pages: '046003', year: 2010, eprint: '0808.0706',
  }),
  // Title and the authors after the first from memory.
  flauger2010: article({
    key: 'flauger2010', authors: ['Flauger, Raphael', 'McAllister, Liam', 'Pajer, Enrico', 'Westphal, Alexander', 'Xu, Gang'],
    title: 'Oscillations in the CMB from Axion Monodromy Inflation', journal: 'JCAP', volume: '06', pages: '009', year: 2010, eprint: '0907.2916',
  }),
  // As the likelihood sets cite it (shared/src/statistics/likelihood-sets.ts).
  planck2018x: article({
    key: 'planck2018x', authors: ['Planck Collaboration', 'Akrami, Y.', 'others'], title: 'Planck 2018 results. X. Constraints on inflation', journal: 'Astron. Astrophys.',
    volume: '641', pages: 'A10', year: 2020, eprint: '1807.06211',
  }),
  // Title and journal from memory; the engine's constants cite it for A_s (arXiv:1807.06209).
  planck2018vi: article({
    key: 'planck2018vi', authors: ['Planck Collaboration', 'Aghanim, N.', 'others'], title: 'Planck 2018 results. VI. Cosmological parameters', journal: 'Astron. Astrophys.',
    volume: '641', pages: 'A6', year: 2020, eprint: '1807.06209',
  }),
  // As the likelihood sets cite it.
  bicepKeck2018: article({
    key: 'bicepKeck2018', authors: ['BICEP/Keck Collaboration'],
    title: 'Improved Constraints on Primordial Gravitational Waves using Planck, WMAP, and BICEP/Keck Observations through the 2018 Observing Season',
    journal: 'Phys. Rev. Lett.', volume: '127', pages: '151301', year: 2021, eprint: '2110.00483',
  }),
  // As the likelihood sets cite it (no journal there).
  actDr6: {
    key: 'actDr6', type: 'misc', authors: ['Louis, Thibaut', 'others'], title: 'The Atacama Cosmology Telescope: DR6 Power Spectra, Likelihoods and ΛCDM Parameters',
    year: 2025, eprint: '2503.14452',
  },
  // From memory: the title and given names; the background equations follow it (background.ts).
  baumann2009: { key: 'baumann2009', type: 'misc', authors: ['Baumann, Daniel'], title: 'TASI Lectures on Inflation', year: 2009, eprint: '0907.5424' },
  // From memory: the title and given names; the one integrator of background and modes (cash-karp.ts).
  cashKarp1990: article({
    key: 'cashKarp1990', authors: ['Cash, J. R.', 'Karp, Alan H.'], title: 'A variable order Runge-Kutta method for initial value problems with rapidly varying right-hand sides',
    journal: 'ACM Trans. Math. Softw.', volume: '16', pages: '201', year: 1990,
  }),
  // From memory: the title and given names; first-order slow roll (slow-roll.ts). No journal: not in the comment.
  liddle1994: { key: 'liddle1994', type: 'misc', authors: ['Liddle, Andrew R.', 'Parsons, Paul', 'Barrow, John D.'], title: 'Formalising the slow-roll approximation in inflation', year: 1994, eprint: 'astro-ph/9408015' },
  // From memory: the title and given names; the running α_s at first order (slow-roll.ts).
  kosowsky1995: { key: 'kosowsky1995', type: 'misc', authors: ['Kosowsky, Arthur', 'Turner, Michael S.'], title: 'CBR anisotropy and the running of the scalar spectral index', year: 1995, eprint: 'astro-ph/9504071' },
  // From memory: the title and given names; second-order slow roll (slow-roll.ts, constants.ts).
  stewart1993: article({
    key: 'stewart1993', authors: ['Stewart, Ewan D.', 'Lyth, David H.'],
    title: 'A more accurate analytic calculation of the spectrum of cosmological perturbations produced during inflation', journal: 'Phys. Lett. B', volume: '302', pages: '171', year: 1993,
  }),
  // From memory: the title and given names; the Hubble-flow functions (slow-roll.ts).
  schwarz2001: {
    key: 'schwarz2001', type: 'misc', authors: ['Schwarz, Dominik J.', 'Terrero-Escalante, Cesar A.', 'Garcia, Alberto A.'], title: 'Higher order corrections to primordial spectra from cosmological inflation',
    year: 2001, eprint: 'astro-ph/0106020',
  },
  // From memory: the title and given names; the mode equations (mode-equations.ts).
  mukhanov1992: article({
    key: 'mukhanov1992', authors: ['Mukhanov, Viatcheslav F.', 'Feldman, H. A.', 'Brandenberger, Robert H.'], title: 'Theory of cosmological perturbations', journal: 'Phys. Rept.',
    volume: '215', pages: '203', year: 1992,
  }),
  // From memory: the title and given names; N_* from the expansion history (reheating.ts). No journal: not in the comment.
  liddle2003: {
    key: 'liddle2003', type: 'misc', authors: ['Liddle, Andrew R.', 'Leach, Samuel M.'], title: 'How long before the end of inflation were observable perturbations produced?',
    year: 2003, eprint: 'astro-ph/0305263',
  },
} satisfies Record<string, CitationRecord>;

/** The papers of each built-in family (`reference` in potential-families.ts, as records). */
export const FAMILY_CITATIONS: Record<string, CitationRecord[]> = {
  monomial: [CITATIONS.linde1983],
  'quadratic-quartic': [CITATIONS.linde1983, CITATIONS.planck2018x],
  starobinsky: [CITATIONS.starobinsky1980],
  natural: [CITATIONS.freese1990],
  'hilltop-quadratic': [CITATIONS.boubekeur2005],
  'hilltop-quartic': [CITATIONS.boubekeur2005, CITATIONS.kohri2007],
  'alpha-t': [CITATIONS.kallosh2013conformal, CITATIONS.kallosh2013attractors],
  'alpha-e': [CITATIONS.kallosh2013attractors],
  // The reference names Vilenkin 1983 and Linde 1983 without details; only the form's source is given.
  'double-well': [CITATIONS.planck2018x],
  'power-law': [CITATIONS.lucchin1985],
  'monodromy-modulated': [CITATIONS.mcallister2010, CITATIONS.flauger2010],
};

/** Every method: the background equations, the integrator and the A_s normalisation at the pivot. */
const BACKGROUND_METHODS = [CITATIONS.baumann2009, CITATIONS.cashKarp1990, CITATIONS.planck2018vi];

/** The methods papers the engine uses for each method (its code comments cite them). */
export const METHOD_CITATIONS: Record<'slowroll' | 'exact', CitationRecord[]> = {
  slowroll: [...BACKGROUND_METHODS, CITATIONS.liddle1994, CITATIONS.kosowsky1995, CITATIONS.stewart1993, CITATIONS.schwarz2001],
  exact: [...BACKGROUND_METHODS, CITATIONS.mukhanov1992],
};

/** N_* from a reheating history. */
export const REHEATING_CITATIONS: CitationRecord[] = [CITATIONS.liddle2003, CITATIONS.planck2018x];

/** The records of the built-in likelihood sources, by arXiv id: a set citing one of these gets the full record. */
export const LIKELIHOOD_SOURCE_CITATIONS: Record<string, CitationRecord> = {
  '1807.06211': CITATIONS.planck2018x,
  '2110.00483': CITATIONS.bicepKeck2018,
  '2503.14452': CITATIONS.actDr6,
};
