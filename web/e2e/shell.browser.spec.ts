import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

// Drives Debian's chromium against a running Sixtyfold (API serving the built web app).
// Run: SIXTYFOLD_WEB_URL=http://127.0.0.1:3060 npm run test:browser -w web
const webUrl = process.env.SIXTYFOLD_WEB_URL?.replace(/\/+$/, '');
const email = process.env.SIXTYFOLD_DEMO_EMAIL ?? 'amara.okafor@halvorsen.example';
const password = process.env.SIXTYFOLD_DEMO_PASSWORD ?? 'inflaton-demo-1';
const screenshotDir = fileURLToPath(new URL('../test-results/screenshots/', import.meta.url));

let profileDir = '';
let context: BrowserContext;
let page: Page;

async function assertReachable(url: string) {
  try {
    await fetch(url, { signal: AbortSignal.timeout(5_000) });
  } catch (error) {
    const reason = error instanceof Error ? (error.cause instanceof Error ? error.cause.message : error.message) : String(error);
    throw new Error(`SIXTYFOLD_WEB_URL=${url} is not reachable (${reason}). Start Sixtyfold first (npm start at the repo root).`);
  }
}

const shot = (name: string) => page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
const heading = (name: string) => page.getByRole('heading', { name, level: 1, exact: true });
const mainNav = () => page.getByRole('navigation', { name: 'Main' });

/** Waits until no "Loading …" status is on screen, so screenshots show data, empty or error states. */
async function settled() {
  await page.waitForFunction(() => ![...document.querySelectorAll('[role="status"]')].some((el) => /Loading/.test(el.textContent ?? '')));
}

async function signIn(withPassword: string) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(withPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

beforeAll(async () => {
  if (!webUrl) {
    throw new Error('SIXTYFOLD_WEB_URL is not set. Point it at a running Sixtyfold, e.g. SIXTYFOLD_WEB_URL=http://127.0.0.1:3060');
  }
  await assertReachable(webUrl);
  mkdirSync(screenshotDir, { recursive: true });
  profileDir = mkdtempSync(join(tmpdir(), 'sixtyfold-chromium-'));
  context = await chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(15_000);
});

afterAll(async () => {
  await context?.close();
  if (profileDir) rmSync(profileDir, { recursive: true, force: true });
});

describe('Sixtyfold web shell', () => {
  it('signs in, visits the main pages and signs out', async () => {
    await page.goto(`${webUrl}/`);
    await page.waitForURL(/\/sign-in\?next=/);
    await heading('Sign in').waitFor();
    await shot('sign-in');

    await signIn(password);
    await heading('Scans').waitFor();
    expect(new URL(page.url()).pathname).toBe('/scans');
    await mainNav().getByRole('link', { name: 'Admin', exact: true }).waitFor();
    await settled();
    await shot('scans');

    await mainNav().getByRole('link', { name: 'Models', exact: true }).click();
    await heading('Models').waitFor();
    await settled();
    await shot('models');

    await mainNav().getByRole('link', { name: 'Compare', exact: true }).click();
    await heading('Compare').waitFor();
    await settled();
    await shot('compare');

    await mainNav().getByRole('link', { name: 'Admin', exact: true }).click();
    await heading('Admin').waitFor();
    await settled();
    // The demo admin is in the users table the API returned.
    await page.getByRole('region', { name: 'Users' }).getByRole('cell', { name: email, exact: true }).waitFor();
    await shot('admin');

    // Narrow screen: the navigation folds into a menu that still offers Admin.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole('button', { name: 'Open navigation' }).click();
    await page.getByRole('menuitem', { name: 'Admin', exact: true }).waitFor();
    await shot('admin-narrow-menu');
    await page.keyboard.press('Escape');
    await page.setViewportSize({ width: 1280, height: 860 });

    await page.getByRole('button', { name: /^Account menu for / }).click();
    await page.getByRole('menuitem', { name: 'Sign out', exact: true }).waitFor();
    await shot('user-menu');
    await page.getByRole('menuitem', { name: 'Sign out', exact: true }).click();
    await page.waitForURL(/\/sign-in$/);
    await heading('Sign in').waitFor();

    // The session is really gone: a protected page sends us back to sign-in.
    await page.goto(`${webUrl}/models`);
    await page.waitForURL(/\/sign-in\?next=%2Fmodels$/);
  });

  it('shows the error for a wrong password', async () => {
    // Start without a session, whatever the previous test left behind.
    await context.clearCookies();
    await page.goto(`${webUrl}/sign-in`);
    await heading('Sign in').waitFor();
    await signIn(`${password}-wrong`);
    const alert = page.getByRole('alert');
    await alert.waitFor();
    // A 429 is also a correct answer if the throttle has already kicked in on repeated runs.
    expect(await alert.textContent()).toMatch(/E-mail or password is wrong|Too many attempts, wait a minute/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await shot('sign-in-error');
  });
});
