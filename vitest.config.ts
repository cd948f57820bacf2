/// <reference types="vitest/config" />
import { getViteConfig } from 'astro/config';

// One vitest run, four projects (see DEVELOPERS.md "Tests"):
//   unit         pure src/lib computations, no database
//   integration  server services on an in-memory PGlite (or DATABASE_URL)
//   api          the built server over HTTP
//   e2e          the built server driven through Debian's Chromium
export default getViteConfig({
  test: {
    globals: true,
    env: {
      PLUMBLINE_DATA_DIR: 'memory://',
      BETTER_AUTH_SECRET: 'test-secret-not-for-production-0123456789abcdef',
      BETTER_AUTH_URL: 'http://localhost:4321',
      ASTRO_TELEMETRY_DISABLED: '1',
      TZ: 'UTC',
    },
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], testTimeout: 20_000 },
      },
    ],
  },
});
