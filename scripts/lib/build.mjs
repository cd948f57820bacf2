// Builds the app when dist/ is missing or older than the sources (shared by start and test).
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

function newest(dir) {
  let t = 0;
  if (!existsSync(dir)) return t;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}

export function buildIfNeeded(root) {
  if (process.env.PLUMBLINE_SKIP_BUILD === '1') return;
  const stamp = join(root, 'dist', 'server', 'entry.mjs');
  const sources = Math.max(
    newest(join(root, 'src')),
    newest(join(root, 'public')),
    newest(join(root, 'drizzle')),
    statSync(join(root, 'astro.config.mjs')).mtimeMs,
    statSync(join(root, 'package.json')).mtimeMs,
  );
  if (existsSync(stamp) && statSync(stamp).mtimeMs >= sources) return;
  console.log('[plumbline] building…');
  const r = spawnSync('npm', ['run', 'build'], { cwd: root, stdio: 'inherit', env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' } });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
