/** The API's routes as the files under src/pages/api declare them: `METHOD /api/path/[param]`. */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { ROOT } from './server-process';

export function apiRoutes(): string[] {
  const base = join(ROOT, 'src', 'pages');
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (/\.(ts|js)$/.test(e.name)) {
        const src = readFileSync(p, 'utf8');
        let path = '/' + relative(base, p).split(sep).join('/').replace(/\.(ts|js)$/, '');
        path = path.replace(/\/index$/, '');
        for (const m of src.matchAll(/export const (GET|POST|PUT|PATCH|DELETE|ALL)\b/g)) out.push(`${m[1]} ${path}`);
      }
    }
  };
  walk(join(base, 'api'));
  return out.sort();
}
