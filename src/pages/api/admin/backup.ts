/**
 * POST /api/admin/backup: a backup of the whole installation (database, files, secret), taken by
 * the process that owns the database, as a .tar.gz download. Admins, or the local command line
 * (`npm run plumbline -- backup <file>`) through the control token (src/server/control.ts).
 */
import { createReadStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { logActivity } from '../../../server/activity';
import { requirePermission } from '../../../server/authz';
import { createBackup } from '../../../server/backup';
import { endpoint } from '../../../server/http';

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'backups');
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-backup-out-'));
  const file = join(dir, 'backup.tar.gz');
  try {
    const manifest = await createBackup(file);
    await logActivity({ action: 'backup.created', userId: actor.id === 'control' ? null : actor.id, actor: actor.email, ip: ctx.clientAddress, details: { kind: manifest.kind, tables: Object.keys(manifest.tables).length, files: manifest.files } });
    const size = statSync(file).size;
    const stream = createReadStream(file);
    stream.once('close', () => rmSync(dir, { recursive: true, force: true }));
    const name = `plumbline-backup-${manifest.createdAt.replace(/[:.]/g, '-')}.tar.gz`;
    return new Response(Readable.toWeb(stream) as ReadableStream, {
      status: 200,
      headers: { 'content-type': 'application/gzip', 'content-length': String(size), 'content-disposition': `attachment; filename="${name}"`, 'cache-control': 'no-store', 'x-plumbline-manifest': Buffer.from(JSON.stringify(manifest)).toString('base64') },
    });
  } catch (e) {
    rmSync(dir, { recursive: true, force: true });
    throw e;
  }
});
