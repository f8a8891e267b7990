import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Kept under test/ so the top level stays as the product design fixes it.
export default defineConfig({
  root: fileURLToPath(new URL('..', import.meta.url)),
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
    setupFiles: ['test/setup.ts'],
    // A zone with daylight saving by default, so nothing depends on the machine's zone; .ci/run repeats
    // the time-sensitive folders with QUERN_TEST_TZ=UTC.
    env: { TZ: process.env.QUERN_TEST_TZ ?? 'America/New_York' },
  },
});
