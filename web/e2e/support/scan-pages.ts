import type { Locator, Page } from 'playwright-core';
import type { z } from 'zod';
import { heading, settled, shot, webUrl } from './browser';

/** The id of the scan whose page is open. */
export const scanIdOnPage = (page: Page) => Number(new URL(page.url()).pathname.match(/^\/scans\/(\d+)/)?.[1]);

/** A GET of the API from the page, so it carries the page's session cookie; the answer read with its shared schema. */
export async function apiGet<S extends z.ZodType>(page: Page, path: string, schema: S): Promise<z.output<S>> {
  const answer = await page.evaluate(async (url) => {
    const response = await fetch(url, { headers: { Accept: 'application/json' } });
    return { status: response.status, body: await response.text() };
  }, `/api${path}`);
  if (answer.status !== 200) throw new Error(`GET /api${path} answered ${answer.status}: ${answer.body}`);
  return schema.parse(JSON.parse(answer.body));
}

/** The text of every body cell, row by row. */
export const cellsOf = (table: Locator) =>
  table.locator('tbody tr').evaluateAll((rows) => rows.map((row) => [...row.querySelectorAll('td')].map((cell) => cell.textContent?.trim() ?? '')));

export interface FormAxis {
  parameter: string;
  kind: 'range' | 'list';
  /** For a range: min, max, count and spacing; for a list: the values as typed. */
  range?: { min: number; max: number; count: number; spacing: 'linear' | 'log' };
  values?: string;
}

/**
 * Fills the new-scan form for a built-in family in `group`, its parameter on axis 1 × N_* on axis 2 (a linear
 * range), slow-roll, launches it and waits on its page until the workers have computed it. Returns its id.
 */
export async function launchFamilyScan(
  page: Page,
  { group, name, family, axis1, nStar, points }: { group: string; name: string; family: string; axis1: FormAxis; nStar: { min: number; max: number; count: number }; points: number },
): Promise<number> {
  await page.goto(`${webUrl}/scans/new`);
  await heading(page, 'New scan').waitFor();
  await settled(page);
  const form = page.getByRole('form', { name: 'New scan' });
  await form.getByLabel('Group').selectOption({ label: group });
  await form.getByLabel('Name', { exact: true }).fill(name);
  await form.getByLabel('Model').selectOption({ label: family });
  await form.getByLabel('Axis 1 parameter').selectOption(axis1.parameter);
  await form.getByLabel('Axis 1 kind').selectOption(axis1.kind);
  if (axis1.range) {
    await form.getByLabel('Axis 1 min').fill(String(axis1.range.min));
    await form.getByLabel('Axis 1 max').fill(String(axis1.range.max));
    await form.getByLabel('Axis 1 count').fill(String(axis1.range.count));
    await form.getByLabel('Axis 1 spacing').selectOption(axis1.range.spacing);
  } else {
    await form.getByLabel('Axis 1 values').fill(axis1.values ?? '');
  }
  if ((await form.getByLabel('Axis 2 parameter').count()) === 0) await form.getByRole('button', { name: 'Add axis' }).click();
  await form.getByLabel('Axis 2 parameter').selectOption('nStar');
  await form.getByLabel('Axis 2 min').fill(String(nStar.min));
  await form.getByLabel('Axis 2 max').fill(String(nStar.max));
  await form.getByLabel('Axis 2 count').fill(String(nStar.count));
  await form.getByLabel('Method', { exact: true }).selectOption('slowroll');
  await form.getByText(`${points} points`).first().waitFor();
  await form.getByRole('button', { name: 'Launch scan' }).click();
  await page.waitForURL(/\/scans\/\d+$/).catch(async (error: Error) => {
    await shot(page, 'scan-refused');
    const said = await page.locator('[role="alert"], [data-part="error-text"]').allTextContents();
    throw new Error(`the scan was not launched: ${said.join(' | ') || error.message}`);
  });
  await heading(page, name).waitFor();
  const id = scanIdOnPage(page);
  // The page polls until the workers are done; nobody reloads.
  await page.getByText('Completed', { exact: true }).first().waitFor({ timeout: 45_000 });
  return id;
}
