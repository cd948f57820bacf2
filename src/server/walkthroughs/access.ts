/**
 * Reaching one walkthrough, finding or measure inside the actor's installations: the scope is in
 * the WHERE clause, so a row elsewhere is simply not found (404), like every other object.
 */
import { and, eq } from 'drizzle-orm';
import type { Db, Tx } from '../../db/client';
import { finding, measure, walkthrough } from '../../db/schema';
import type { WalkthroughStatus } from '../../lib/field/walkthrough-form';
import { can, scopeToInstallations, type Actor, type Permission } from '../authz';
import { errors } from '../http';

export interface WalkthroughRef {
  id: string;
  buildingId: string;
  installationId: string;
  status: WalkthroughStatus;
  formVersion: number;
  plannedOn: string;
  flagId: string | null;
  auditorId: string | null;
  title: string;
}

const refColumns = {
  id: walkthrough.id,
  buildingId: walkthrough.buildingId,
  installationId: walkthrough.installationId,
  status: walkthrough.status,
  formVersion: walkthrough.formVersion,
  plannedOn: walkthrough.plannedOn,
  flagId: walkthrough.flagId,
  auditorId: walkthrough.auditorId,
  title: walkthrough.title,
};

/** The walkthrough if the actor may see it. @throws 404 */
export async function walkthroughRef(db: Db | Tx, actor: Actor, id: string, lock = false): Promise<WalkthroughRef> {
  const q = db
    .select(refColumns)
    .from(walkthrough)
    .where(and(eq(walkthrough.id, id), scopeToInstallations(actor, walkthrough.installationId)));
  const [row] = lock ? await q.for('update') : await q;
  if (!row) throw errors.notFound('No such walkthrough in your installations.');
  return row as WalkthroughRef;
}

export interface FindingRef {
  id: string;
  walkthroughId: string;
  installationId: string;
  buildingId: string;
  title: string;
  walkthroughStatus: WalkthroughStatus;
  plannedOn: string;
}

/** The finding if the actor may see it. @throws 404 */
export async function findingRef(db: Db | Tx, actor: Actor, id: string): Promise<FindingRef> {
  const [row] = await db
    .select({ id: finding.id, walkthroughId: finding.walkthroughId, installationId: finding.installationId, buildingId: finding.buildingId, title: finding.title, walkthroughStatus: walkthrough.status, plannedOn: walkthrough.plannedOn })
    .from(finding)
    .innerJoin(walkthrough, eq(walkthrough.id, finding.walkthroughId))
    .where(and(eq(finding.id, id), scopeToInstallations(actor, finding.installationId)));
  if (!row) throw errors.notFound('No such finding in your installations.');
  return row as FindingRef;
}

/** The measure (with its finding's walkthrough date) if the actor may see it. @throws 404 */
export async function measureRef(db: Db | Tx, actor: Actor, id: string, lock = false) {
  const q = db
    .select({ measure, plannedOn: walkthrough.plannedOn })
    .from(measure)
    .innerJoin(walkthrough, eq(walkthrough.id, measure.walkthroughId))
    .where(and(eq(measure.id, id), scopeToInstallations(actor, measure.installationId)));
  const [row] = lock ? await q.for('update', { of: measure }) : await q;
  if (!row) throw errors.notFound('No such measure in your installations.');
  return row;
}

/** The actor holding at least one of the permissions. @throws 403 */
export function requireAny(actor: Actor, permissions: Permission[], what: string): void {
  if (!permissions.some((p) => can(actor, p))) throw errors.forbidden(`Your role (${actor.role}) may not ${what}.`);
}
