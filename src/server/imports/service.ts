/** Import records: list, read, undo, report and original file, within the actor's installations. */
import { and, desc, eq, inArray } from 'drizzle-orm';
import { promisify } from 'node:util';
import { gunzip } from 'node:zlib';
import { getDb } from '../../db/client';
import { rawTransaction } from '../../db/raw-tx';
import { importFile, importRun, installation } from '../../db/schema';
import { logActivity } from '../activity';
import { scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';
import { undoImport } from './write';
import { dataChanged } from '../baselines/run';

const gunzipAsync = promisify(gunzip);

const listColumns = {
  id: importRun.id,
  kind: importRun.kind,
  status: importRun.status,
  installationCode: installation.code,
  fileName: importRun.fileName,
  fileBytes: importRun.fileBytes,
  counts: importRun.counts,
  problemCount: importRun.problemCount,
  uploadedByEmail: importRun.uploadedByEmail,
  createdAt: importRun.createdAt,
  committedAt: importRun.committedAt,
  undoneAt: importRun.undoneAt,
};

export async function listImports(actor: Actor, query: { installationId?: string | undefined; includeDryRuns?: boolean; limit?: number }) {
  const db = await getDb();
  return db
    .select(listColumns)
    .from(importRun)
    .innerJoin(installation, eq(installation.id, importRun.installationId))
    .where(
      and(
        scopeToInstallations(actor, importRun.installationId),
        query.installationId ? eq(importRun.installationId, query.installationId) : undefined,
        // By default the imports that changed bills: in effect or undone; checks and refusals on request.
        query.includeDryRuns ? undefined : inArray(importRun.status, ['committed', 'undone']),
      ),
    )
    .orderBy(desc(importRun.createdAt))
    .limit(query.limit ?? 100)
    .then((rows) => rows);
}

export async function getImport(actor: Actor, id: string) {
  const db = await getDb();
  const [row] = await db
    .select({ ...listColumns, installationId: importRun.installationId, mapping: importRun.mapping, problems: importRun.problems, fileSha256: importRun.fileSha256, undoneBy: importRun.undoneBy })
    .from(importRun)
    .innerJoin(installation, eq(installation.id, importRun.installationId))
    .where(and(eq(importRun.id, id), scopeToInstallations(actor, importRun.installationId)));
  if (!row) throw errors.notFound('No such import in your installations.');
  return row;
}

/** Undoes a committed import. @throws 409 when it is not committed or a later import changed its bills. */
export async function undoCommittedImport(actor: Actor, id: string, ip = '') {
  const current = await getImport(actor, id);
  if (current.status === 'undone') throw errors.conflict('This import was already undone.');
  if (current.status !== 'committed') throw errors.conflict('Only a committed import can be undone (a dry run stored nothing).');
  const result = await rawTransaction(async (tx) => {
    const [locked] = await tx.query<{ status: string }>(`select status from import_run where id = $1 for update`, [id]);
    if (locked?.status !== 'committed') return { ok: false as const, laterImport: null };
    const r = await undoImport(tx, id);
    if (r.ok) await tx.query(`update import_run set status = 'undone', undone_at = now(), undone_by = $2 where id = $1`, [id, actor.id]);
    return r;
  });
  if (!result.ok) {
    if (result.laterImport) throw errors.conflict(`A later import (${result.laterImport}) changed some of these bills. Undo that import first.`, { laterImport: result.laterImport });
    throw errors.conflict('This import is no longer committed.');
  }
  if (current.installationId) await dataChanged([current.installationId], 'import undone');
  await logActivity({ action: 'import.undo', userId: actor.id, actor: actor.email, entityType: 'import', entityId: id, installationId: current.installationId, ip, details: { removed: result.removed, restored: result.restored } });
  return { ...(await getImport(actor, id)), removed: result.removed, restored: result.restored };
}

/** The uploaded file as it was received. */
export async function importOriginal(actor: Actor, id: string): Promise<{ fileName: string; bytes: Buffer }> {
  const run = await getImport(actor, id);
  const db = await getDb();
  const [f] = await db.select().from(importFile).where(eq(importFile.importId, run.id));
  if (!f) throw errors.notFound('The original file of this import is not kept (dry runs keep only their report).');
  return { fileName: run.fileName, bytes: await gunzipAsync(Buffer.from(f.content)) };
}
