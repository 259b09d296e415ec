import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['src/**/*.spec.ts', 'test/**/*.spec.ts', 'cli/**/*.spec.mjs'],
    environment: 'node',
    // The engine checks integrate many trajectories; on a busy 2-core machine one can take 10 s.
    // Speed is measured by `npm run bench`, never by a test's time limit.
    testTimeout: 60_000,
  },
});
