/** What the planner needs for one building: the building, its open flag, the auditors who may go, walkthroughs already planned, and the instruments to bring. */
import { and, desc, eq, inArray, isNull } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { building, buildingFlag, installation, walkthrough } from '../../db/schema';
import { scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';
import { auditorsOf } from './auditors';
import { suggestionsForBuilding } from './signature';

export async function planningContext(actor: Actor, buildingId: string) {
  const db = await getDb();
  const [b] = await db
    .select({ id: building.id, number: building.number, name: building.name, useType: building.useType, grossAreaFt2: building.grossAreaFt2, yearBuilt: building.yearBuilt, lastEvaluatedOn: building.lastEvaluatedOn, installationId: building.installationId, installationCode: installation.code, installationName: installation.name })
    .from(building)
    .innerJoin(installation, eq(installation.id, building.installationId))
    .where(and(eq(building.id, buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  const [flag] = await db
    .select({ id: buildingFlag.id, reason: buildingFlag.reason, flaggedAt: buildingFlag.flaggedAt })
    .from(buildingFlag)
    .where(and(eq(buildingFlag.buildingId, buildingId), isNull(buildingFlag.clearedAt)))
    .orderBy(desc(buildingFlag.flaggedAt))
    .limit(1);
  const open = await db
    .select({ id: walkthrough.id, title: walkthrough.title, plannedOn: walkthrough.plannedOn, status: walkthrough.status })
    .from(walkthrough)
    .where(and(eq(walkthrough.buildingId, buildingId), inArray(walkthrough.status, ['planned', 'in-progress'])))
    .orderBy(desc(walkthrough.plannedOn));
  const { installationId, ...rest } = b;
  return {
    building: rest,
    flag: flag ? { id: flag.id, reason: flag.reason, flaggedAt: flag.flaggedAt.toISOString() } : null,
    auditors: (await auditorsOf(db, installationId)).map(({ id, name }) => ({ id, name })),
    openWalkthroughs: open,
    suggestions: await suggestionsForBuilding(actor, buildingId),
  };
}
