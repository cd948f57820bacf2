/**
 * `backup <file>`: a backup of the database, files and secret. On the embedded database with the
 * server running, the server takes it (through the local control channel) while it keeps serving;
 * with the server stopped, this command opens the folder itself. On PostgreSQL, pg_dump.
 * `restore <file> [--force]`: the reverse, into a stopped data folder or the DATABASE_URL database.
 */
import { createWriteStream, existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { parseArgs, withDatabase } from './db-session';

function summary(m: { kind: string; tables: Record<string, number>; files: number; createdAt: string }): string {
  const rows = Object.values(m.tables).reduce((a, b) => a + b, 0);
  return `${m.kind} database, ${Object.keys(m.tables).length} tables, ${rows.toLocaleString('en-US')} rows, ${m.files} files, taken ${m.createdAt}`;
}

export async function backupCommand(argv: string[], out: NodeJS.WritableStream): Promise<number> {
  const { positional, flags } = parseArgs(argv, ['json']);
  const target = positional[0];
  if (!target) {
    process.stderr.write('usage: plumbline backup <file.tar.gz> [--json]\n');
    return 2;
  }
  const file = resolve(target);
  const { lockHolder } = await import('../../db/lock');
  const { dataDir, MEMORY } = await import('../../db/paths');
  const dir = dataDir();
  if (!process.env.DATABASE_URL && dir !== MEMORY && lockHolder(dir)) {
    const { readControlFile, CONTROL_HEADER } = await import('../../server/control');
    const control = readControlFile(dir);
    if (!control) {
      process.stderr.write(`A Plumbline process holds ${dir} but left no control file: stop it, or download a backup as an admin (POST /api/admin/backup).\n`);
      return 2;
    }
    const res = await fetch(`${control.url}/api/admin/backup`, { method: 'POST', headers: { [CONTROL_HEADER]: control.token } }).catch((e: Error) => e);
    if (res instanceof Error || !res.ok || !res.body) {
      const why = res instanceof Error ? res.message : `${res.status} ${await res.text()}`;
      process.stderr.write(`The running server at ${control.url} did not take the backup: ${why}\n`);
      return 1;
    }
    await pipeline(Readable.fromWeb(res.body as import('node:stream/web').ReadableStream), createWriteStream(file));
    const manifest = JSON.parse(Buffer.from(res.headers.get('x-plumbline-manifest') ?? '', 'base64').toString('utf8') || '{}');
    out.write(flags.has('json') ? `${JSON.stringify({ file, via: 'server', manifest })}\n` : `Backup written to ${file} by the running server: ${summary(manifest)}\n`);
    return 0;
  }
  return withDatabase(process.stderr, async () => {
    const { createBackup } = await import('../../server/backup');
    const manifest = await createBackup(file);
    out.write(flags.has('json') ? `${JSON.stringify({ file, via: 'direct', manifest })}\n` : `Backup written to ${file}: ${summary(manifest)}\n`);
    return 0;
  });
}

export async function restoreCommand(argv: string[], out: NodeJS.WritableStream): Promise<number> {
  const { positional, flags } = parseArgs(argv, ['force', 'json']);
  const source = positional[0];
  if (!source) {
    process.stderr.write('usage: plumbline restore <file.tar.gz> [--force] [--json]\n');
    return 2;
  }
  const file = resolve(source);
  if (!existsSync(file)) {
    process.stderr.write(`No backup file at ${file}.\n`);
    return 2;
  }
  const { restoreBackup, BackupError } = await import('../../server/backup');
  const { DataDirLockedError } = await import('../../db/lock');
  try {
    const r = await restoreBackup(file, { databaseUrl: process.env.DATABASE_URL, force: flags.has('force') });
    if (flags.has('json')) out.write(`${JSON.stringify(r)}\n`);
    else {
      out.write(`Restored ${summary(r.manifest)}.\n`);
      for (const k of r.keptAside) out.write(`The data it replaced is kept at ${k}: delete it once you have checked the restore.\n`);
    }
    return 0;
  } catch (e) {
    if (e instanceof BackupError || e instanceof DataDirLockedError) {
      process.stderr.write(`${e.message}\n`);
      return 2;
    }
    throw e;
  }
}
