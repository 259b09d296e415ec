import { evidenceComparisonSchema, scanConstraintsSchema, type EvidenceComparison, type ScanConstraints } from '@sixtyfold/shared';
import type { Locator, Page } from 'playwright-core';
import { formatInterval } from '@/features/scans/utils/format-interval';
import { inputLabel } from '@/lib/point-labels';
import { formatNumber } from '@/lib/format-number';
import { heading, settled, shot, signIn, webUrl, useBrowserSession } from './support/browser';
import { apiGet, cellsOf, launchFamilyScan } from './support/scan-pages';

// The PI of "Plateau Models" in the demo scenario: may launch scans in the group.
const PI = 'henrik.solberg@halvorsen.example';
const GROUP = 'Plateau Models';
// Names must be new on every run: the test database keeps what earlier runs created.
const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
const T_MODEL_SCAN = `Browser T-model, α × N_* (${stamp})`;
const MONOMIAL_SCAN = `Browser φ^p, p × N_* (${stamp})`;
const PLANCK = 'planck18-bk18';
const PACT = 'pact-lb-bk18';
// N_* from 50 to 60 on both scans, 3 values.
const N_STAR = { min: 50, max: 60, count: 3 };

let page: Page;
useBrowserSession((session) => (page = session.page));

/**
 * Each axis's row as the constraints tab prints it, from the API's answer: the parameter (with its
 * edge warning, if any, right after the name), the 68 % and the 95 % cell.
 */
function expectedRows(answer: ScanConstraints): string[][] {
  return answer.constraints.map((constraint) => {
    const at = (level: number) => constraint.intervals.find((i) => i.level === level);
    const one = at(0.68);
    const two = at(0.95);
    return [`${inputLabel(constraint.axis)}${constraint.edgeWarning ?? ''}`, one ? formatInterval(one) : '—', two ? formatInterval(two) : '—'];
  });
}

/** The constraints table as [parameter, 68 %, 95 %] per row (the prior column is left out). */
const shownRows = async (table: Locator) => (await cellsOf(table)).map(([parameter, , one, two]) => [parameter, one, two]);

/** The evidence table of one set as the compare page prints it, row by row. */
async function shownEvidence(title: RegExp) {
  const table = page.getByRole('table', { name: title });
  await table.waitFor();
  return (await cellsOf(table)).map(([rank, scan, lnZ, lnB, twoLnB, verdict]) => ({ rank, scan, lnZ, lnB, twoLnB, verdict }));
}

/** The same rows from the API's answer, with the numbers formatted as the page formats them. */
function expectedEvidence(comparison: EvidenceComparison, key: string) {
  const set = comparison.sets.find((s) => s.likelihood.kind === 'set' && s.likelihood.key === key);
  if (!set) throw new Error(`the evidence answer has no set ${key}`);
  const number = (value: number | null, digits: number) => formatNumber(value, digits, 'power');
  return set.scans.map((row) => ({
    rank: String(row.rank),
    scan: row.name,
    lnZ: row.lnZ === null ? '—' : `${number(row.lnZ, 4)} ± ${number(row.lnZError, 2)}`,
    lnB: number(row.lnB, 3),
    twoLnB: number(row.twoLnB, 3),
    verdict: row.verdict ?? '—',
  }));
}

describe('what the data allow, in the browser', () => {
  it('reads an α-attractor scan’s constraints and compares its evidence with φ^p under Planck and P-ACT-LB', async () => {
    await page.goto(`${webUrl}/sign-in`);
    await signIn(page, PI);
    await heading(page, 'Overview').waitFor();

    // The T-model (Kallosh & Linde 2013, arXiv:1306.5220): α on a log range × N_*, 6 × 3 points.
    const tModel = await launchFamilyScan(page, {
      group: GROUP,
      name: T_MODEL_SCAN,
      family: 'α-attractor, T-model',
      axis1: { parameter: 'alpha', kind: 'range', range: { min: 0.1, max: 100, count: 6, spacing: 'log' } },
      nStar: N_STAR,
      points: 18,
    });
    await shot(page, 'constraints-t-model-scan');

    // Its constraints under Planck 2018 + BICEP/Keck 2018, the default set.
    await page.getByRole('tab', { name: 'Constraints', exact: true }).click();
    const table = page.getByRole('table', { name: 'Parameter constraints' });
    await table.waitFor({ timeout: 30_000 });
    await page.getByText('arXiv:2110.00483').first().waitFor();
    await settled(page);
    const planck = await apiGet(page, `/scans/${tModel}/constraints?likelihood=${PLANCK}`, scanConstraintsSchema);
    expect(planck.likelihood).toMatchObject({ kind: 'set', key: PLANCK });
    expect(planck.constraints.map((c) => c.axis)).toEqual(['alpha', 'nStar']);
    const planckRows = expectedRows(planck);
    expect(await shownRows(table)).toEqual(planckRows);
    await shot(page, 'constraints-t-model-planck');

    // Physically (Kallosh, Linde & Roest 2013, arXiv:1311.0472: n_s ≈ 1 − 2/N_*, r ≈ 12α/N_*²): every
    // point inflates; the 68 % region of N_* lies on its axis; BICEP/Keck's r < 0.036 bounds α from
    // above well inside the axis (α = 25 gives r ≈ 0.1 at N_* = 55), while nothing bounds it from
    // below, so the 95 % region reaches α = 0.1 and the tab says so.
    expect(planck.excluded.count).toBe(0);
    expect(planck.included).toBe(18);
    expect(planck.priors.find((p) => p.axis === 'alpha')?.prior).toBe('log');
    const interval = (answer: ScanConstraints, axis: string, level: number) =>
      answer.constraints.find((c) => c.axis === axis)?.intervals.find((i) => i.level === level);
    const nStar68 = interval(planck, 'nStar', 0.68);
    expect(nStar68).toBeDefined();
    expect(nStar68!.lower).toBeGreaterThanOrEqual(N_STAR.min);
    expect(nStar68!.upper).toBeLessThanOrEqual(N_STAR.max);
    expect(nStar68!.lower).toBeLessThan(nStar68!.upper);
    const alpha95 = interval(planck, 'alpha', 0.95);
    expect(alpha95).toBeDefined();
    expect(alpha95!.upper).toBeGreaterThan(1);
    expect(alpha95!.upper).toBeLessThan(25);
    expect(planck.constraints.find((c) => c.axis === 'alpha')?.edgeWarning).toMatch(/reaches alpha = 0\.1\b/);

    // P-ACT-LB's n_s = 0.974 ± 0.003 pulls N_* up: the table follows the picked set.
    const picker = page.getByLabel('Likelihood set');
    const pactOption = await picker.locator('option', { hasText: 'P-ACT-LB' }).getAttribute('value');
    expect(pactOption).toMatch(new RegExp(`^${PACT}@\\d+$`));
    await picker.selectOption(pactOption!);
    await page.getByText('arXiv:2503.14452').first().waitFor();
    await settled(page);
    const pact = await apiGet(page, `/scans/${tModel}/constraints?likelihood=${pactOption}`, scanConstraintsSchema);
    expect(pact.likelihood).toMatchObject({ kind: 'set', key: PACT });
    const pactRows = expectedRows(pact);
    expect(pactRows).not.toEqual(planckRows);
    expect(await shownRows(table)).toEqual(pactRows);
    expect(interval(pact, 'nStar', 0.68)!.lower).toBeGreaterThan(nStar68!.lower);
    expect(new URL(page.url()).searchParams.get('likelihood')).toBe(pactOption);
    await shot(page, 'constraints-t-model-pact');

    // φ^p (Linde 1983) over p × N_*, 4 × 3 points: φ² at 50 ≤ N_* ≤ 60 lies outside Planck + BICEP/Keck's 95 % region.
    const monomial = await launchFamilyScan(page, {
      group: GROUP, name: MONOMIAL_SCAN, family: 'Monomial (chaotic) inflation', axis1: { parameter: 'p', kind: 'list', values: '0.5, 1, 2, 3' }, nStar: N_STAR, points: 12,
    });

    // Both scans on the compare page, the T-model first and so the reference.
    await page.goto(`${webUrl}/compare?scans=${tModel},${monomial}`);
    await heading(page, 'Compare').waitFor();
    await page.getByRole('heading', { name: 'Evidence and Bayes factors' }).waitFor({ timeout: 30_000 });
    const planckTitle = /^Evidence under Planck 2018 \+ BICEP\/Keck 2018 /;
    const pactTitle = /^Evidence under P-ACT-LB \+ BICEP\/Keck 2018 /;
    const planckTable = page.getByRole('table', { name: planckTitle });
    const pactTable = page.getByRole('table', { name: pactTitle });
    await planckTable.waitFor({ timeout: 30_000 });
    await pactTable.waitFor();
    await settled(page);
    await shot(page, 'compare-evidence');

    const comparison = await apiGet(page, `/scans/evidence?ids=${tModel},${monomial}&likelihoods=${PLANCK},${PACT}&reference=${tModel}`, evidenceComparisonSchema);
    expect(comparison.referenceId).toBe(tModel);
    for (const [key, title] of [[PLANCK, planckTitle], [PACT, pactTitle]] as const) {
      const shown = await shownEvidence(title);
      expect(shown).toEqual(expectedEvidence(comparison, key));
      // Both scans ranked 1 and 2; the reference has ln B = 0, the other a verdict in Kass & Raftery's words.
      expect(shown.map((row) => row.rank).sort()).toEqual(['1', '2']);
      expect(shown.map((row) => row.scan).sort()).toEqual([T_MODEL_SCAN, MONOMIAL_SCAN].sort());
      const reference = shown.find((row) => row.scan === T_MODEL_SCAN)!;
      expect(reference.lnB).toBe('0');
      expect(reference.verdict).toBe('the reference');
      const other = shown.find((row) => row.scan === MONOMIAL_SCAN)!;
      expect(other.verdict).toMatch(
        new RegExp(`^(evidence not worth more than a bare mention|positive evidence|strong evidence|very strong evidence) for scan (${tModel}|${monomial}) over scan (${tModel}|${monomial})$`),
      );
    }
    // Under Planck + BICEP/Keck the plateau fits and the monomials' tensors do not: the T-model ranks first.
    expect((await shownEvidence(planckTitle)).find((row) => row.rank === '1')?.scan).toBe(T_MODEL_SCAN);

    // The two sets' tables side by side: their titles level with each other, Planck's on the left.
    const planckBox = await page.getByRole('heading', { level: 3, name: /^Planck 2018 \+ BICEP\/Keck 2018 / }).boundingBox();
    const pactBox = await page.getByRole('heading', { level: 3, name: /^P-ACT-LB \+ BICEP\/Keck 2018 / }).boundingBox();
    expect(planckBox && pactBox).toBeTruthy();
    expect(Math.abs(planckBox!.y - pactBox!.y)).toBeLessThan(1);
    expect(pactBox!.x).toBeGreaterThan(planckBox!.x + planckBox!.width);
    await page.getByText(comparison.note).first().waitFor();

    // The regions drawn as regions: both sets' joint regions filled on the plane (two sets × two
    // levels), and on the scan's own maps the chosen set's 68/95 % boundary lines.
    const plane = page.getByRole('img', { name: /with the regions of Planck 2018 \+ BICEP\/Keck 2018 and P-ACT-LB \+ BICEP\/Keck 2018$/ });
    await plane.scrollIntoViewIfNeeded();
    await plane.locator('.scatterlayer .fills path').nth(3).waitFor({ state: 'attached', timeout: 30_000 });
    await settled(page);
    await shot(page, 'compare-regions');
    await page.goto(`${webUrl}/scans/${tModel}`);
    const rMap = page.getByRole('img', { name: /^Heatmap of r over/ });
    await rMap.locator('.contourlevel path').first().waitFor({ state: 'attached', timeout: 30_000 });
    await page.getByText(/^Lines: the 68.3 % \(solid, Δχ² = 2.30\) and 95.4 % \(dashed, Δχ² = 6.18\) boundaries/).waitFor();
    await settled(page);
    await shot(page, 'scan-boundaries');
  });
});
