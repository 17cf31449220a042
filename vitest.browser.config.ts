import { defineConfig } from 'vitest/config';

// Browser tests: real headless Chromium driven by playwright-core against the
// production build served by `vite preview`. One file at a time: two cores here.
export default defineConfig({
  test: {
    environment: 'node',
    include: ['test/browser/**/*.test.ts'],
    globalSetup: ['test/browser/global-setup.ts'],
    setupFiles: ['test/browser/setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: false,
  },
});
