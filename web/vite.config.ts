import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

// In production the API serves the built app from the same origin; in dev we proxy to it.
const apiUrl = process.env.SIXTYFOLD_API_URL ?? 'http://127.0.0.1:3060';

export default defineConfig({
  plugins: [react()],
  resolve: { alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) } },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: apiUrl, changeOrigin: false } },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
  build: {
    // Chakra + React + Router make one ~900 kB chunk (≈270 kB gzipped); expected for this stack.
    chunkSizeWarningLimit: 1200,
  },
  test: {
    environment: 'happy-dom',
    globals: true,
    setupFiles: ['./src/testing/test-setup.ts'],
    include: ['src/**/*.spec.{ts,tsx}'],
    // Generous: a busy 2-core machine renders a page of Chakra slowly; this is not a speed check.
    testTimeout: 20_000,
    restoreMocks: true,
    unstubGlobals: true,
  },
});
