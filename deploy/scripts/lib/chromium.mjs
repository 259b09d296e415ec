// Debian's chromium driven by playwright-core (a dependency of the web workspace), signed in
// with a session cookie of the API's; for the benchmark's page-draw and live-page figures.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';

export async function openChromium(webUrl, cookie) {
  const profileDir = mkdtempSync(path.join(tmpdir(), 'sixtyfold-bench-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--enable-precise-memory-info'],
  });
  const [name, ...value] = cookie.split('=');
  await context.addCookies([{ name, value: value.join('='), url: webUrl }]);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    page,
    async close() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}
