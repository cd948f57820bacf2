#!/usr/bin/env node
// `npm test`: build if needed, then every vitest project (unit, integration, api, e2e), and a
// closing line "N passed, N failed". Extra arguments go to vitest (e.g. `npm test -- --project unit`).
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildIfNeeded } from './lib/build.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
process.env.ASTRO_TELEMETRY_DISABLED = '1';

if (!existsSync('/usr/bin/chromium')) {
  const msg = 'Chromium is not installed at /usr/bin/chromium: the browser tests cannot run (apt-get install chromium).';
  if (process.env.REQUIRE_BROWSER === '1') {
    console.error(`\n✗ ${msg}\n`);
    process.exit(1);
  }
  console.warn(`\n${'!'.repeat(78)}\n! ${msg}\n! They will be reported as skipped. Set REQUIRE_BROWSER=1 to make this an error.\n${'!'.repeat(78)}\n`);
}

buildIfNeeded(root);

mkdirSync(join(root, 'test-results'), { recursive: true });
const report = join(root, 'test-results', 'vitest.json');
const r = spawnSync(
  join(root, 'node_modules', '.bin', 'vitest'),
  ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...process.argv.slice(2)],
  { cwd: root, stdio: 'inherit', env: process.env },
);
try {
  const j = JSON.parse(readFileSync(report, 'utf8'));
  console.log(`\n${j.numPassedTests} passed, ${j.numFailedTests} failed${j.numPendingTests ? `, ${j.numPendingTests} skipped` : ''}`);
} catch {
  /* vitest did not get far enough to write its report */
}
process.exit(r.status ?? 1);
