import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: { include: ['src/**/*.spec.ts', 'test/**/*.spec.ts', 'cli/**/*.spec.mjs'], environment: 'node' },
});
