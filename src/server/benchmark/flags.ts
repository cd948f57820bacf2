/**
 * Flags for a walkthrough: the manager marks a building with a reason, which moves it up the
 * shortlist and tells the installation's energy staff by mail. Clearing a flag keeps its history.
 */
import { and, desc, eq, isNull } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { building, buildingFlag, installation, user, userInstallation } from '../../db/schema';
import { logActivity } from '../activity';
import { scopeToInstallations, type Actor } from '../authz';
import { appBaseUrl } from '../config';
import { errors } from '../http';
import { sendMail } from '../mail';

export async function flagBuilding(actor: Actor, input: { buildingId: string; reason: string }, ip = '') {
  const db = await getDb();
  const [b] = await db
    .select({ id: building.id, number: building.number, name: building.name, installationId: building.installationId, code: installation.code, instName: installation.name })
    .from(building)
    .innerJoin(installation, eq(installation.id, building.installationId))
    .where(and(eq(building.id, input.buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  const [open] = await db.select({ id: buildingFlag.id }).from(buildingFlag).where(and(eq(buildingFlag.buildingId, b.id), isNull(buildingFlag.clearedAt)));
  if (open) throw errors.conflict(`Building ${b.number} is already flagged for a walkthrough.`);
  const [flag] = await db.insert(buildingFlag).values({ buildingId: b.id, installationId: b.installationId, reason: input.reason, flaggedBy: actor.id }).returning();
  const staff = await db
    .select({ email: user.email, name: user.name })
    .from(userInstallation)
    .innerJoin(user, eq(user.id, userInstallation.userId))
    .where(and(eq(userInstallation.installationId, b.installationId), eq(user.role, 'installation_staff')));
  for (const s of staff) {
    await sendMail({
      to: s.email,
      subject: `Walkthrough wanted: building ${b.number} at ${b.code}`,
      text:
        `Hello ${s.name},\n\n${actor.name} flagged building ${b.number} (${b.name}) at ${b.instName} for a walkthrough audit.\n\n` +
        `Reason: ${input.reason}\n\nThe building's figures and why it ranks where it does: ${appBaseUrl()}/buildings/${b.id}\n` +
        `Plan the walkthrough from there, with a kit from the loaner library.\n`,
    });
  }
  await logActivity({ action: 'shortlist.flag', userId: actor.id, actor: actor.email, entityType: 'building', entityId: b.id, installationId: b.installationId, ip, details: { reason: input.reason, notified: staff.map((s) => s.email) } });
  return { ...flag!, notified: staff.map((s) => s.email) };
}

export async function clearFlag(actor: Actor, flagId: string, ip = '') {
  const db = await getDb();
  const done = await db
    .update(buildingFlag)
    .set({ clearedAt: new Date(), clearedBy: actor.id })
    .where(and(eq(buildingFlag.id, flagId), isNull(buildingFlag.clearedAt), scopeToInstallations(actor, buildingFlag.installationId)))
    .returning({ id: buildingFlag.id, buildingId: buildingFlag.buildingId, installationId: buildingFlag.installationId });
  if (done.length === 0) throw errors.notFound('No open flag with this id in your installations.');
  await logActivity({ action: 'shortlist.unflag', userId: actor.id, actor: actor.email, entityType: 'building', entityId: done[0]!.buildingId, installationId: done[0]!.installationId, ip });
}

export async function listFlags(actor: Actor, q: { buildingId?: string | undefined; open?: boolean }) {
  const db = await getDb();
  return db
    .select({ id: buildingFlag.id, buildingId: buildingFlag.buildingId, buildingNumber: building.number, installationCode: installation.code, reason: buildingFlag.reason, flaggedAt: buildingFlag.flaggedAt, clearedAt: buildingFlag.clearedAt, flaggedBy: user.email })
    .from(buildingFlag)
    .innerJoin(building, eq(building.id, buildingFlag.buildingId))
    .innerJoin(installation, eq(installation.id, buildingFlag.installationId))
    .leftJoin(user, eq(user.id, buildingFlag.flaggedBy))
    .where(and(scopeToInstallations(actor, buildingFlag.installationId), q.buildingId ? eq(buildingFlag.buildingId, q.buildingId) : undefined, q.open ? isNull(buildingFlag.clearedAt) : undefined))
    .orderBy(desc(buildingFlag.flaggedAt));
}
