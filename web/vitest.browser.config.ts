import { defineConfig } from 'vitest/config';

// Drives a real chromium against a running Sixtyfold (SIXTYFOLD_WEB_URL); not part of `npm test`.
export default defineConfig({
  test: {
    environment: 'node',
    include: ['e2e/**/*.browser.spec.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
    globals: true,
  },
});
