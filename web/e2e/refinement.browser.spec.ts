import { refinedPointPageSchema, scanGridSliceSchema, scanLineageSchema } from '@sixtyfold/shared';
import type { Page } from 'playwright-core';
import { SET_COLORS } from '@/features/scans/utils/plane-figure';
import { REFINED_POINTS_PAGE_SIZE } from '@/features/refinement/api/get-refined-points';
import { heading, settled, shot, signIn, webUrl, useBrowserSession } from './support/browser';
import { apiGet, cellsOf, launchFamilyScan, scanIdOnPage } from './support/scan-pages';

// The PI of "Plateau Models" in the demo scenario: may launch and refine scans in the group.
const PI = 'henrik.solberg@halvorsen.example';
// Names must be new on every run: the test database keeps what earlier runs created.
const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
const PARENT = `Browser T-model to refine (${stamp})`;

let page: Page;
useBrowserSession((session) => (page = session.page));

/** The stroke colours and dash patterns of the path shapes Plotly drew in a heatmap (rectangles have no stroke). */
const strokesOf = (heatmap: ReturnType<Page['getByRole']>) =>
  heatmap.locator('.shapelayer path').evaluateAll((paths) =>
    paths.map((path) => ({ stroke: (path as SVGPathElement).style.stroke, dash: (path as SVGPathElement).style.strokeDasharray, width: (path as SVGPathElement).style.strokeWidth })),
  );

describe('refining a scan, in the browser', () => {
  it('refines a T-model grid at the 95 % boundary and shows every level merged: lineage, heatmap cells and lines, the merged table', async () => {
    await page.goto(`${webUrl}/sign-in`);
    await signIn(page, PI);
    await heading(page, 'Overview').waitFor();

    // The T-model (Kallosh & Linde 2013, arXiv:1306.5220) over log α 0.1–100 × N_* 45–65: 9 × 5 points.
    const parent = await launchFamilyScan(page, {
      group: 'Plateau Models',
      name: PARENT,
      family: 'α-attractor, T-model',
      axis1: { parameter: 'alpha', kind: 'range', range: { min: 0.1, max: 100, count: 9, spacing: 'log' } },
      nStar: { min: 45, max: 65, count: 5 },
      points: 45,
    });

    // Refine at the 95 % region of planck18-bk18 (the dialog's default boundary), factor 2 on both axes, two levels.
    await page.getByRole('button', { name: 'Refine…' }).click();
    const dialog = page.getByRole('dialog', { name: `Refine “${PARENT}”` });
    await dialog.getByLabel('Depth (levels)').selectOption('2');
    await dialog.getByTestId('refine-estimate').waitFor();
    await shot(page, 'refinement-dialog');
    await dialog.getByRole('button', { name: 'Launch refinement' }).click();
    // The new level's page opens.
    await page.waitForURL((url) => /^\/scans\/\d+$/.test(url.pathname) && url.pathname !== `/scans/${parent}`);
    expect(scanIdOnPage(page)).toBeGreaterThan(parent);
    const lineage = page.getByLabel('Refinement lineage');
    await lineage.getByText(`Level 1 of the refinement of scan ${parent}`).waitFor();

    // The parent's page follows the chain until both levels are computed; nobody reloads.
    await page.goto(`${webUrl}/scans/${parent}`);
    await heading(page, PARENT).waitFor();
    await lineage.getByText(/level 2 · [\d,]+ points · completed/).waitFor({ timeout: 60_000 });
    await lineage.getByText(/level 1 · [\d,]+ points · completed/).waitFor();
    const chain = await apiGet(page, `/scans/${parent}/lineage`, scanLineageSchema);
    expect(chain.levels.map((level) => level.level)).toEqual([1, 2]);

    // The heatmaps, read again as each level completed, draw the levels' finer cells over the grid's and the set's boundary through them.
    const nsMap = page.getByRole('img', { name: /^Heatmap of n_s/ });
    await nsMap.locator('.main-svg').first().waitFor({ timeout: 30_000 });
    const refined = await apiGet(page, `/scans/${parent}/grid?x=alpha&y=nStar&output=ns`, scanGridSliceSchema);
    expect(refined.refined?.cells.length).toBeGreaterThan(0);
    const setStroke = `rgb(${SET_COLORS[0].rgb})`;
    await page.waitForFunction(
      ({ stroke }) => [...document.querySelectorAll('.shapelayer path')].some((path) => (path as SVGPathElement).style.stroke === stroke),
      { stroke: setStroke },
      { timeout: 30_000 },
    );
    await settled(page);
    const strokes = await strokesOf(nsMap);
    // One rectangle per refined cell (no stroke), then each drawn level's line: white under the set's colour.
    expect(strokes.filter((s) => s.width === '0px' || s.width === '0').length).toBe(refined.refined!.cells.length);
    const lines = strokes.filter((s) => s.stroke === setStroke);
    expect(lines.length).toBeGreaterThan(0);
    // The 95 % line, the one the levels refined, is dashed.
    expect(lines.some((s) => s.dash !== '' && s.dash !== 'none')).toBe(true);
    await shot(page, 'refinement-parent-heatmaps');

    // The points of every level in one table, sorted by n_s as the API sorts them.
    await lineage.getByRole('button', { name: 'Points of every level' }).click();
    const table = page.getByRole('table', { name: 'Points of every level' });
    await table.waitFor();
    await page.getByRole('button', { name: /^Sort by n_s/ }).click();
    await page.getByRole('button', { name: 'Sort by n_s, now ascending' }).waitFor();
    await settled(page);
    const sorted = await apiGet(page, `/scans/${parent}/refinement/points?sort=ns&order=asc&pageSize=${REFINED_POINTS_PAGE_SIZE}`, refinedPointPageSchema);
    expect(sorted.total).toBe(45 + chain.levels.reduce((n, level) => n + level.totalPoints, 0));
    const shown = (await cellsOf(table)).map(([level, scan, point]) => [level, scan, point]);
    expect(shown).toEqual(sorted.items.map((p) => [String(p.level), String(p.scanId), String(p.pointIndex)]));
    expect(new Set(shown.map(([level]) => level)).size).toBeGreaterThan(1);
    await shot(page, 'refinement-merged-points');
  }, 120_000);
});
