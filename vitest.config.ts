/// <reference types="vitest/config" />
import { getViteConfig } from 'astro/config';

// One vitest run, four projects (see DEVELOPERS.md "Tests"):
//   unit         pure src/lib computations, no database
//   integration  server services on a fresh in-memory PGlite per file (or a PostgreSQL database
//                per file when DATABASE_URL is set)
//   api          the built server over HTTP (loopback)
//   e2e          the built server driven through Debian's Chromium
const env = {
  PLUMBLINE_DATA_DIR: 'memory://',
  PLUMBLINE_DEMO: '0',
  PLUMBLINE_JOBS: '0',
  BETTER_AUTH_SECRET: 'test-secret-not-for-production-0123456789abcdef',
  BETTER_AUTH_URL: 'http://localhost:4321',
  ASTRO_TELEMETRY_DISABLED: '1',
  TZ: 'UTC',
};

export default getViteConfig({
  test: {
    globals: true,
    env,
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], testTimeout: 30_000 },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/support/integration-global.ts'],
          setupFiles: ['tests/support/integration-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          globalSetup: ['tests/support/server-global.ts'],
          testTimeout: 60_000,
          hookTimeout: 180_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/support/server-global.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
