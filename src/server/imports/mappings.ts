/** Column mappings saved per installation for reuse on the next file of the same shape. */
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { columnMapping } from '../../db/schema';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';

export async function listMappings(actor: Actor, installationCode: string) {
  const db = await getDb();
  const inst = await installationByCode(db, actor, installationCode);
  return db
    .select({ id: columnMapping.id, name: columnMapping.name, mapping: columnMapping.mapping, createdAt: columnMapping.createdAt })
    .from(columnMapping)
    .where(eq(columnMapping.installationId, inst.id))
    .orderBy(asc(columnMapping.name));
}

/** Saves (or replaces, by name) a mapping for the installation. */
export async function saveMapping(actor: Actor, input: { installation: string; name: string; mapping: Record<string, string> }) {
  const db = await getDb();
  const inst = await installationByCode(db, actor, input.installation);
  const [row] = await db
    .insert(columnMapping)
    .values({ installationId: inst.id, name: input.name, mapping: input.mapping, createdBy: actor.id })
    .onConflictDoUpdate({ target: [columnMapping.installationId, columnMapping.name], set: { mapping: input.mapping, createdBy: actor.id, createdAt: new Date() } })
    .returning({ id: columnMapping.id, name: columnMapping.name, mapping: columnMapping.mapping });
  return row!;
}

export async function deleteMapping(actor: Actor, id: string) {
  const db = await getDb();
  const gone = await db
    .delete(columnMapping)
    .where(and(eq(columnMapping.id, id), scopeToInstallations(actor, columnMapping.installationId)))
    .returning({ id: columnMapping.id });
  if (gone.length === 0) throw errors.notFound('No such saved mapping in your installations.');
}
