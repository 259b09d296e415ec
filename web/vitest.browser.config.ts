import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Drives a real chromium against a running Sixtyfold (SIXTYFOLD_WEB_URL); not part of `npm test`.
export default defineConfig({
  // The app's own '@/…' paths, so a test formats numbers with the helpers the pages use.
  resolve: { alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) } },
  test: {
    environment: 'node',
    include: ['e2e/**/*.browser.spec.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
    globals: true,
  },
});
