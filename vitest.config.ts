import { defineConfig } from 'vitest/config';
import preact from '@preact/preset-vite';

// Unit tests: Node environment, fake-indexeddb for the store. Browser tests live in
// test/browser and run with vitest.browser.config.ts against a real Chromium.
export default defineConfig({
  plugins: [preact()],
  test: {
    environment: 'node',
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/browser/**', 'node_modules/**'],
    setupFiles: ['fake-indexeddb/auto'],
    // Property and fuzz tests run hundreds of cases; on a loaded 2-core machine the 5 s default
    // turns a slow pass into a failure. A real hang still fails, at 30 s.
    testTimeout: 30_000,
  },
});
