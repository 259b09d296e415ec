import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { heading, mainNav, settled, shot, signIn, webUrl, useBrowserSession } from './support/browser';

// A group lead of the demo scenario: may create models and launch scans in "Plateau Models".
const LEAD = 'henrik.solberg@halvorsen.example';
const GROUP = 'Plateau Models';
// Names must be new on every run: the test database keeps what earlier runs created.
const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
const MODEL = `E-model browser check ${stamp}`;

// The α-attractor E-model with n = 1 (Kallosh, Linde & Roest 2013, arXiv:1311.0472).
const GOOD_EXPRESSION = 'V0 * (1 - exp(-sqrt(2 / (3 * alpha)) * phi))^2';
const BAD_EXPRESSION = 'V0 * (1 - expp(-sqrt(2 / (3 * alpha)) * phi))^2';
// α on a pasted list × N_* over a range: 3 × 3 = 9 points, a few seconds for one worker.
const ALPHAS = '1, 2, 3';
const POINTS = 9;

let page: Page;
useBrowserSession((session) => (page = session.page));

/** The id of the scan whose page is open. */
const scanIdOnPage = () => Number(new URL(page.url()).pathname.match(/^\/scans\/(\d+)/)?.[1]);

/** Fills the new-scan form for the model above, α on a list and N_* on a range, and launches it. */
async function launchScan(name: string, nStarMax: number) {
  const form = page.getByRole('form', { name: 'New scan' });
  await form.getByLabel('Group').selectOption({ label: GROUP });
  await form.getByLabel('Name', { exact: true }).fill(name);
  await form.getByLabel('Model').selectOption({ label: MODEL });
  await form.getByLabel('Axis 1 parameter').selectOption('alpha');
  await form.getByLabel('Axis 1 kind').selectOption('list');
  await form.getByLabel('Axis 1 values').fill(ALPHAS);
  await form.getByRole('button', { name: 'Add axis' }).click();
  await form.getByLabel('Axis 2 parameter').selectOption('nStar');
  await form.getByLabel('Axis 2 min').fill('50');
  await form.getByLabel('Axis 2 max').fill(String(nStarMax));
  await form.getByLabel('Axis 2 count').fill('3');
  // The summary counts the points before anything is sent.
  await form.getByText(`${POINTS} points`).first().waitFor();
  await shot(page, 'scan-new');
  await form.getByRole('button', { name: 'Launch scan' }).click();
  await page.waitForURL(/\/scans\/\d+$/).catch(async (error: Error) => {
    // Say what the form said, rather than only that the page did not change.
    await shot(page, 'scan-new-refused');
    const said = await page.locator('[role="alert"], [data-part="error-text"]').allTextContents();
    throw new Error(`the scan was not launched: ${said.join(' | ') || error.message}`);
  });
  await heading(page, name).waitFor();
  return scanIdOnPage();
}

/** Waits until the scan page says Completed: the page polls, nobody reloads. */
async function watchUntilCompleted() {
  await page.getByText('Completed', { exact: true }).first().waitFor({ timeout: 120_000 });
}

describe('a research group in the browser', () => {
  it('defines a model, launches scans, reads their maps and points, compares them and exports', async () => {
    await page.goto(`${webUrl}/sign-in`);
    await signIn(page, LEAD);
    await heading(page, 'Overview').waitFor();
    await settled(page);
    await shot(page, 'overview');

    // A model with a typo: the expression is checked as it is typed, saying where and why.
    await mainNav(page).getByRole('link', { name: 'Models', exact: true }).click();
    await heading(page, 'Models').waitFor();
    await settled(page);
    await shot(page, 'models');
    await page.getByRole('link', { name: 'New model' }).first().click();
    await heading(page, 'New model').waitFor();
    const modelForm = page.getByRole('form', { name: 'New model' });
    await modelForm.getByLabel('Group').selectOption({ label: GROUP });
    await modelForm.getByLabel('Name', { exact: true }).fill(MODEL);
    await modelForm.getByLabel('Parameter 1 name').fill('V0');
    await modelForm.getByLabel('Parameter 1 default').fill('1e-10');
    await modelForm.getByRole('button', { name: 'Add parameter' }).click();
    await modelForm.getByLabel('Parameter 2 name').fill('alpha');
    await modelForm.getByLabel('Parameter 2 default').fill('1');
    await modelForm.getByLabel('φ_init').fill('8');
    await modelForm.getByLabel('Expression V(φ)').fill(BAD_EXPRESSION);
    const problem = modelForm.getByText(/at character 11: unsupported function 'expp'/i);
    await problem.first().waitFor();
    await shot(page, 'model-expression-error');

    await modelForm.getByLabel('Expression V(φ)').fill(GOOD_EXPRESSION);
    await problem.first().waitFor({ state: 'detached' });
    await modelForm.getByRole('button', { name: 'Create model' }).click();
    await heading(page, MODEL).waitFor();
    await settled(page);
    await shot(page, 'model');

    // Launch a small scan of it and watch it complete.
    await page.goto(`${webUrl}/scans/new`);
    await heading(page, 'New scan').waitFor();
    await settled(page);
    const first = await launchScan(`Browser E-model, N_* 50 to 60 (${stamp})`, 60);
    await watchUntilCompleted();

    // Both heatmaps drawn by Plotly, with every cell stored.
    const nsMap = page.getByRole('img', { name: /^Heatmap of n_s over/ });
    const rMap = page.getByRole('img', { name: /^Heatmap of r over/ });
    await nsMap.locator('.main-svg').first().waitFor();
    await rMap.locator('.main-svg').first().waitFor();
    await settled(page);
    await shot(page, 'scan-heatmaps');

    await page.getByRole('tab', { name: /n_s–r plane/ }).click();
    await page.getByRole('img', { name: /n_s–r plane/ }).locator('.main-svg').first().waitFor();
    await settled(page);
    await shot(page, 'scan-plane');

    // The points table, its CSV export (checked row by row against the table's count), and one point.
    await page.getByRole('tab', { name: /Points/ }).click();
    const table = page.getByRole('table', { name: 'Points of the scan' });
    await table.waitFor();
    await page.getByText(`${POINTS} points`).first().waitFor();
    await shot(page, 'scan-points');
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'CSV', exact: true }).click();
    const csvPath = await (await download).path();
    // Lines starting with # say what computed the scan (pandas: comment='#').
    const lines = readFileSync(csvPath, 'utf8').trim().split('\n').filter((line) => !line.startsWith('#'));
    expect(lines[0].split(',')).toEqual(expect.arrayContaining(['pointIndex', 'alpha', 'nStar', 'status', 'ns', 'r']));
    const rows = lines.slice(1).map((line) => line.split(','));
    expect(rows).toHaveLength(POINTS);
    const columns = lines[0].split(',');
    for (const row of rows) {
      expect(row[columns.indexOf('status')]).toBe('ok');
      const ns = Number(row[columns.indexOf('ns')]);
      // The E-model at α ≤ 3 and N_* = 50–60 sits near n_s ≈ 1 − 2/N (arXiv:1311.0472): 0.96–0.97.
      expect(ns).toBeGreaterThan(0.95);
      expect(ns).toBeLessThan(0.975);
    }
    expect(rows.map((row) => Number(row[0])).sort((a, b) => a - b)).toEqual([...Array(POINTS).keys()]);

    // How it was computed: the build and the workers, a reproducibility check on today's engine, the BibTeX.
    await page.getByRole('tab', { name: 'How this was computed' }).click();
    const computed = page.getByRole('region', { name: 'How this was computed' });
    await computed.getByRole('table', { name: 'Workers' }).waitFor();
    await computed.getByRole('button', { name: 'Check reproducibility' }).click();
    await computed.getByText(`All ${POINTS} recomputed points are identical to the stored ones, bit for bit.`).waitFor({ timeout: 60_000 });
    expect(await computed.getByLabel('BibTeX', { exact: true }).textContent()).toContain('@software{sixtyfold');
    await settled(page);
    await shot(page, 'scan-computed');
    await page.getByRole('tab', { name: /Points/ }).click();
    await table.waitFor();

    await table.getByRole('link', { name: 'Open point 4' }).click();
    await heading(page, 'Point 4').waitFor();
    await page.getByRole('img', { name: 'Trajectory plot of φ against N' }).locator('.main-svg').first().waitFor();
    await page.getByRole('img', { name: 'Trajectory plot of ε_H against N' }).locator('.main-svg').first().waitFor();
    await settled(page);
    await shot(page, 'point');

    // A second scan from a copy of the first, over N_* 50 to 55, then both compared.
    await page.goto(`${webUrl}/scans/${first}`);
    await heading(page, /Browser E-model/).waitFor();
    await page.getByRole('link', { name: 'Clone scan' }).click();
    await heading(page, 'New scan').waitFor();
    const cloneForm = page.getByRole('form', { name: 'New scan' });
    await cloneForm.getByLabel('Name', { exact: true }).fill(`Browser E-model, N_* 50 to 55 (${stamp})`);
    await cloneForm.getByLabel('Axis 2 max').fill('55');
    await cloneForm.getByRole('button', { name: 'Launch scan' }).click();
    await page.waitForURL(/\/scans\/\d+$/);
    const second = scanIdOnPage();
    expect(second).not.toBe(first);
    await watchUntilCompleted();

    await page.goto(`${webUrl}/compare?scans=${first},${second}`);
    await heading(page, 'Compare').waitFor();
    const compared = page.getByRole('img', { name: /^Heatmap of n_s over/ });
    await compared.nth(1).locator('.main-svg').first().waitFor({ timeout: 30_000 });
    expect(await compared.count()).toBe(2);
    await page.getByRole('img', { name: /n_s–r plane/ }).locator('.main-svg').first().waitFor();
    await settled(page);
    await shot(page, 'compare-two-scans');
    expect(new URL(page.url()).searchParams.get('scans')).toBe(`${first},${second}`);
  });
});
