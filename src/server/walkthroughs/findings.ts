/**
 * Findings of a walkthrough: what the auditor saw (title, category, location, description,
 * photos), each possibly priced as a measure. Findings can be added and edited until the
 * walkthrough is cancelled (the analysis goes on after the visit); one whose measure was
 * approved or implemented cannot be deleted.
 */
import { asc, eq, inArray } from 'drizzle-orm';
import type { Db, Tx } from '../../db/client';
import { getDb } from '../../db/client';
import { finding, measure, photo } from '../../db/schema';
import type { FindingCategory } from '../../lib/field/walkthrough-form';
import type { FindingInput, FindingPatch } from '../../lib/field/walkthrough-api';
import { logActivity } from '../activity';
import type { Actor } from '../authz';
import { errors } from '../http';
import { measureView, type MeasureView } from '../measures/view';
import { findingRef, walkthroughRef } from './access';

export interface FindingItem {
  id: string;
  title: string;
  category: FindingCategory;
  location: string;
  description: string;
  status: 'open' | 'dismissed';
  createdAt: string;
  updatedAt: string;
  photoIds: string[];
  measure: MeasureView | null;
}

export async function findingsOf(db: Db | Tx, walkthroughId: string): Promise<FindingItem[]> {
  const rows = await db.select().from(finding).where(eq(finding.walkthroughId, walkthroughId)).orderBy(asc(finding.createdAt));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const measures = await db.select().from(measure).where(inArray(measure.findingId, ids));
  const photos = await db.select({ id: photo.id, findingId: photo.findingId }).from(photo).where(inArray(photo.findingId, ids)).orderBy(asc(photo.createdAt));
  return rows.map((r) => {
    const m = measures.find((x) => x.findingId === r.id);
    return {
      id: r.id,
      title: r.title,
      category: r.category as FindingCategory,
      location: r.location,
      description: r.description,
      status: r.status as 'open' | 'dismissed',
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
      photoIds: photos.filter((p) => p.findingId === r.id).map((p) => p.id),
      measure: m ? measureView(m) : null,
    };
  });
}

async function findingItem(db: Db | Tx, id: string, walkthroughId: string): Promise<FindingItem> {
  return (await findingsOf(db, walkthroughId)).find((f) => f.id === id)!;
}

export async function createFinding(actor: Actor, walkthroughId: string, input: FindingInput, ip = ''): Promise<FindingItem> {
  const db = await getDb();
  const w = await walkthroughRef(db, actor, walkthroughId);
  if (w.status === 'cancelled') throw errors.conflict('This walkthrough is cancelled: restore it to add findings.', { reason: 'not-editable' });
  const [row] = await db
    .insert(finding)
    .values({ walkthroughId, installationId: w.installationId, buildingId: w.buildingId, ...input, createdBy: actor.id })
    .returning({ id: finding.id });
  await logActivity({ action: 'finding.add', userId: actor.id, actor: actor.email, entityType: 'finding', entityId: row!.id, installationId: w.installationId, ip, details: { walkthroughId, title: input.title, category: input.category } });
  return findingItem(db, row!.id, walkthroughId);
}

export async function updateFinding(actor: Actor, id: string, patch: FindingPatch, ip = ''): Promise<FindingItem> {
  const db = await getDb();
  const f = await findingRef(db, actor, id);
  if (f.walkthroughStatus === 'cancelled') throw errors.conflict('This walkthrough is cancelled: restore it to change its findings.', { reason: 'not-editable' });
  await db.update(finding).set({ ...patch, updatedAt: new Date() }).where(eq(finding.id, id));
  await logActivity({ action: 'finding.update', userId: actor.id, actor: actor.email, entityType: 'finding', entityId: id, installationId: f.installationId, ip, details: { fields: Object.keys(patch) } });
  return findingItem(db, id, f.walkthroughId);
}

export async function deleteFinding(actor: Actor, id: string, ip = ''): Promise<void> {
  const db = await getDb();
  const f = await findingRef(db, actor, id);
  const [m] = await db.select({ status: measure.status }).from(measure).where(eq(measure.findingId, id));
  if (m && (m.status === 'approved' || m.status === 'implemented')) throw errors.conflict(`Its measure is ${m.status}: the finding stays on record. Dismiss it instead.`, { reason: 'measure-decided' });
  if (f.walkthroughStatus === 'cancelled') throw errors.conflict('This walkthrough is cancelled.', { reason: 'not-editable' });
  await db.delete(finding).where(eq(finding.id, id));
  await logActivity({ action: 'finding.delete', userId: actor.id, actor: actor.email, entityType: 'finding', entityId: id, installationId: f.installationId, ip, details: { walkthroughId: f.walkthroughId, title: f.title } });
}
