import { describe, expect, it } from 'vitest';
import { POTENTIAL_FAMILIES } from '../engine/families/potential-families.js';
import { findLikelihoodSet } from '../statistics/likelihood-sets.js';
import { bibtexEntry, escapeBibtex, toBibtex } from './bibtex.js';
import { CITATIONS, FAMILY_CITATIONS } from './citation-records.js';
import { scanCitations } from './scan-citations.js';

const build = { engineVersion: '0.1.0', commit: '0123456789abcdef0123456789abcdef01234567', node: 'v20.20.2' };
const keysOf = (bib: string) => [...bib.matchAll(/^@\w+\{([^,]+),$/gm)].map((m) => m[1]);

describe('BibTeX', () => {
  it("escapes LaTeX's special characters and writes Greek letters as math", () => {
    expect(escapeBibtex('50% of A&B_1 #2 $5 {x} a\\b ~c ^d')).toBe('50\\% of A\\&B\\_1 \\#2 \\$5 \\{x\\} a\\textbackslash{}b \\textasciitilde{}c \\textasciicircum{}d');
    expect(escapeBibtex('α-Attractors and ΛCDM')).toBe('{$\\alpha$}-Attractors and {$\\Lambda$}CDM');
    expect(escapeBibtex('Marín, Lucía')).toBe('Marín, Lucía');
  });

  it('writes an entry with the fields it has, a collaboration braced and the title protected', () => {
    expect(bibtexEntry(CITATIONS.planck2018x)).toBe(
      '@article{planck2018x,\n' +
        '  author = {{Planck Collaboration} and Akrami, Y. and others},\n' +
        '  title = {{Planck 2018 results. X. Constraints on inflation}},\n' +
        '  journal = {Astron. Astrophys.},\n' +
        '  volume = {641},\n' +
        '  pages = {A10},\n' +
        '  year = {2020},\n' +
        '  eprint = {1807.06211},\n' +
        '  archivePrefix = {arXiv}\n' +
        '}\n',
    );
  });

  it('gives one entry per key: a paper cited by the family and by the likelihood set appears once', () => {
    const records = scanCitations({ family: 'quadratic-quartic', method: 'slowroll', pivot: 'fixed', likelihoodSources: findLikelihoodSet('planck18')!.sources, build, year: 2026 });
    expect(records.filter((r) => r.key === 'planck2018x')).toHaveLength(2);
    const keys = keysOf(toBibtex(records));
    expect(keys.filter((k) => k === 'planck2018x')).toHaveLength(1);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('refuses two different records under one key', () => {
    expect(() => toBibtex([CITATIONS.linde1983, { ...CITATIONS.linde1983, year: 1984 }])).toThrow(/two different citations under the key linde1983/);
  });

  it("cites the method's own papers: slow-roll formulas or the mode equations", () => {
    const keys = (method: 'slowroll' | 'exact', pivot: 'fixed' | 'reheating' = 'fixed') => keysOf(toBibtex(scanCitations({ family: 'natural', method, pivot, build, year: 2026 })));
    expect(keys('slowroll')).toEqual(['sixtyfold010', 'freese1990', 'baumann2009', 'cashKarp1990', 'planck2018vi', 'liddle1994', 'kosowsky1995', 'stewart1993', 'schwarz2001']);
    expect(keys('exact')).toEqual(['sixtyfold010', 'freese1990', 'baumann2009', 'cashKarp1990', 'planck2018vi', 'mukhanov1992']);
    expect(keys('exact', 'reheating')).toEqual([...keys('exact'), 'liddle2003', 'planck2018x']);
  });

  it('cites Sixtyfold as software with its version and commit, and a custom source as given', () => {
    const bib = toBibtex(scanCitations({
      family: null, method: 'slowroll', pivot: 'fixed', build, year: 2026,
      likelihoodSources: [{ label: 'Lab survey #3', citation: 'Halvorsen Institute note 12 (100% internal)', arxiv: '2601.01234' }],
    }));
    expect(bib).toContain('@software{sixtyfold010,\n  title = {{Sixtyfold: parameter scans of inflationary potentials}},\n  year = {2026},\n  version = {0.1.0},\n  note = {commit 0123456789abcdef0123456789abcdef01234567}\n}');
    expect(bib).toContain('@misc{arxiv260101234,\n  title = {{Lab survey \\#3}},\n  eprint = {2601.01234},\n  archivePrefix = {arXiv},\n  note = {Halvorsen Institute note 12 (100\\% internal)}\n}');
  });

  it('has the papers of every built-in family', () => {
    for (const family of POTENTIAL_FAMILIES) expect(FAMILY_CITATIONS[family.key]?.length).toBeGreaterThan(0);
  });
});
