/**
 * Roll-ups of measures per walkthrough and per installation (totals of savings and cost, the
 * portfolio's payback, counts by status), with the walkthroughs counted by status beside them.
 */
import { asc, eq, sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { installation, walkthrough } from '../../db/schema';
import { WALKTHROUGH_STATUSES, type WalkthroughStatus } from '../../lib/field/walkthrough-form';
import { rollUpMeasures, type MeasureRollup, type RollupMeasure } from '../../lib/savings/measure-rollup';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { listMeasures } from './service';
import type { MeasureView } from './view';

export function toRollupMeasure(m: MeasureView): RollupMeasure {
  return { ...m, pvSavingsUsd: m.economics?.result.pvSavingsUsd ?? null };
}

export interface InstallationRollup {
  installationCode: string;
  installationName: string;
  walkthroughs: Record<WalkthroughStatus, number>;
  measures: MeasureRollup;
}

/** One roll-up per installation in the actor's scope (or the one named). */
export async function installationRollups(actor: Actor, code?: string): Promise<InstallationRollup[]> {
  const db = await getDb();
  const only = code ? await installationByCode(db, actor, code) : null;
  const insts = only ? [only] : await db.select().from(installation).where(scopeToInstallations(actor, installation.id)).orderBy(asc(installation.code));
  const counts = await db
    .select({ id: walkthrough.installationId, status: walkthrough.status, n: sql<number>`count(*)::int` })
    .from(walkthrough)
    .where(only ? eq(walkthrough.installationId, only.id) : scopeToInstallations(actor, walkthrough.installationId))
    .groupBy(walkthrough.installationId, walkthrough.status);
  const measures = await listMeasures(actor, code ? { installation: code } : {});
  return insts.map((i) => ({
    installationCode: i.code,
    installationName: i.name,
    walkthroughs: Object.fromEntries(WALKTHROUGH_STATUSES.map((s) => [s, counts.find((c) => c.id === i.id && c.status === s)?.n ?? 0])) as Record<WalkthroughStatus, number>,
    measures: rollUpMeasures(measures.filter((m) => m.installationCode === i.code).map(toRollupMeasure)),
  }));
}
