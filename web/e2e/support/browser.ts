import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

// Drives Debian's chromium against a running Sixtyfold (API serving the built web app).
// Run: SIXTYFOLD_WEB_URL=http://127.0.0.1:3060 npm run test:browser -w web
export const webUrl = process.env.SIXTYFOLD_WEB_URL?.replace(/\/+$/, '') ?? '';
export const DEMO_PASSWORD = process.env.SIXTYFOLD_DEMO_PASSWORD ?? 'inflaton-demo-1';
const screenshotDir = fileURLToPath(new URL('../../test-results/screenshots/', import.meta.url));

async function assertReachable(url: string) {
  try {
    await fetch(url, { signal: AbortSignal.timeout(5_000) });
  } catch (error) {
    const reason = error instanceof Error ? (error.cause instanceof Error ? error.cause.message : error.message) : String(error);
    throw new Error(`SIXTYFOLD_WEB_URL=${url} is not reachable (${reason}). Start Sixtyfold first (npm start at the repo root).`);
  }
}

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

/** A fresh chromium profile at a laptop-sized viewport; screenshots go under web/test-results/. */
export async function openBrowser(): Promise<BrowserSession> {
  if (!webUrl) {
    throw new Error('SIXTYFOLD_WEB_URL is not set. Point it at a running Sixtyfold, e.g. SIXTYFOLD_WEB_URL=http://127.0.0.1:3060');
  }
  await assertReachable(webUrl);
  mkdirSync(screenshotDir, { recursive: true });
  const profileDir = mkdtempSync(join(tmpdir(), 'sixtyfold-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 860 },
    acceptDownloads: true,
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
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(15_000);
  return {
    context,
    page,
    async close() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/** One chromium for the whole test file: opened before its tests, closed after them. */
export function useBrowserSession(onOpen: (session: BrowserSession) => void): void {
  let session: BrowserSession | undefined;
  beforeAll(async () => {
    session = await openBrowser();
    onOpen(session);
  });
  afterAll(async () => {
    await session?.close();
  });
}

export const shot = (page: Page, name: string) => page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
export const heading = (page: Page, name: string | RegExp) => page.getByRole('heading', { name, level: 1, exact: typeof name === 'string' });
export const mainNav = (page: Page) => page.getByRole('navigation', { name: 'Main' });

/** Waits until no "Loading …" status is on screen, so screenshots show data, empty or error states. */
export async function settled(page: Page) {
  await page.waitForFunction(() => ![...document.querySelectorAll('[role="status"]')].some((el) => /Loading/.test(el.textContent ?? '')));
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: /^Account menu for / }).click();
  await page.getByRole('menuitem', { name: 'Sign out', exact: true }).click();
  await page.waitForURL(/\/sign-in$/);
}
