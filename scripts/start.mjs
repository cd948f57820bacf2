#!/usr/bin/env node
// `npm start`: refuse at once if another Plumbline process holds the data folder, build when the
// build is missing or older than the sources, then run the server entry (src/server/main.ts).
import { spawn } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildIfNeeded } from './lib/build.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
process.env.ASTRO_TELEMETRY_DISABLED = '1';

// 1. The data-folder lock (the server takes it for real; this only fails fast and clearly).
if (!process.env.DATABASE_URL) {
  const dir = resolve(root, process.env.PLUMBLINE_DATA_DIR || 'data');
  const lock = join(dir, 'plumbline.lock');
  if (existsSync(lock)) {
    try {
      const info = JSON.parse(readFileSync(lock, 'utf8'));
      let alive = false;
      try {
        process.kill(info.pid, 0);
        alive = true;
      } catch (e) {
        alive = e.code === 'EPERM';
      }
      if (alive || info.host !== hostname()) {
        console.error(
          `\nAnother Plumbline process (pid ${info.pid}, started ${info.startedAt}) is using the data folder ${dir}.\n` +
            'Only one process may open an embedded database. Stop that process first, or set PLUMBLINE_DATA_DIR to another folder.\n',
        );
        process.exit(2);
      }
    } catch {
      /* unreadable lock: the server decides */
    }
  }
}

// 2. Build when needed.
buildIfNeeded(root);

// 3. Serve.
const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'src', 'server', 'main.ts')], {
  cwd: root,
  stdio: 'inherit',
  env: process.env,
});
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
