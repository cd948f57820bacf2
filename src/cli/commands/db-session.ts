/**
 * For commands that work on the database: open it (taking the data-folder lock, so a running
 * server makes the command stop with a clear message), act as a system actor, and close.
 */
import { userInfo } from 'node:os';
import type { Actor } from '../../server/authz';

export async function withDatabase(err: NodeJS.WritableStream, fn: (actor: Actor) => Promise<number>): Promise<number> {
  const { getDatabase, closeDatabase } = await import('../../db/client');
  const { DataDirLockedError } = await import('../../db/lock');
  const { ensureSecret } = await import('../../server/runtime');
  try {
    ensureSecret();
    await getDatabase();
  } catch (e) {
    if (e instanceof DataDirLockedError) {
      err.write(`${e.message}\nWhile the server runs, use the API instead (POST /api/imports, POST /api/weather/stations/:code/observations).\n`);
      return 2;
    }
    throw e;
  }
  let user = 'unknown';
  try {
    user = userInfo().username;
  } catch {
    /* no passwd entry */
  }
  const actor: Actor = { id: 'cli', email: `cli:${user}`, name: `command line (${user})`, role: 'admin', installationIds: [], scoped: false };
  try {
    return await fn(actor);
  } finally {
    const { stopLocalSmtp } = await import('../../server/mail/local-smtp');
    await stopLocalSmtp().catch(() => undefined);
    await closeDatabase();
  }
}

/** `--name value` options and positional arguments. */
export function parseArgs(argv: string[], flags: readonly string[]): { positional: string[]; options: Record<string, string>; flags: Set<string> } {
  const positional: string[] = [];
  const options: Record<string, string> = {};
  const set = new Set<string>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a.startsWith('--')) {
      const name = a.slice(2);
      if (flags.includes(name)) set.add(name);
      else options[name] = argv[++i] ?? '';
    } else positional.push(a);
  }
  return { positional, options, flags: set };
}
