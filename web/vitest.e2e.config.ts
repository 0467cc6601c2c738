import { defineConfig } from 'vitest/config';

/** Browser journeys: the built app and API on a throwaway database, driven in Debian's Chromium. */
export default defineConfig({
  test: {
    include: ['e2e/**/*.e2e.ts'],
    environment: 'node',
    globalSetup: ['./e2e/global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: false,
  },
});
