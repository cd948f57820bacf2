/**
 * Loads the demo scenario into an empty database: its data (src/db/seed/load.ts) and its accounts,
 * all with the password `plumbline-demo-2026`, created through the same service admins use.
 */
import { count, eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { appSetting, region } from '../db/schema';
import { loadFieldData, loadScenarioData } from '../db/seed/load';
import { generateDemoScenario } from '../db/seed/scenario';
import { DEMO_PASSWORD } from './config';
import { createUser } from './services/users';

/** Loads the demo into an empty database (no region yet). Returns whether it loaded. */
export async function seedDemoIfEmpty(options: { today?: string } = {}): Promise<boolean> {
  const db = await getDb();
  const [{ n } = { n: 0 }] = await db.select({ n: count() }).from(region);
  if (Number(n) > 0) return false;
  const started = Date.now();
  const scenario = generateDemoScenario({ today: options.today ?? process.env.PLUMBLINE_DEMO_TODAY ?? new Date().toISOString().slice(0, 10) });
  await db.transaction((tx) => loadScenarioData(tx, scenario));
  for (const p of scenario.people) {
    await createUser(null, { email: p.email, name: p.name, role: p.role, installations: p.installationCodes }, DEMO_PASSWORD);
  }
  // Kits, loans, flags and walkthroughs name people: loaded once their accounts exist.
  await db.transaction((tx) => loadFieldData(tx, scenario));
  const { refitBaselines } = await import('./baselines/run');
  const fits = await refitBaselines({}, 'demo');
  const { computeBuildingMetrics } = await import('./benchmark/metrics');
  await computeBuildingMetrics({}, options.today ?? process.env.PLUMBLINE_DEMO_TODAY ?? new Date().toISOString().slice(0, 10));
  console.log(
    `[demo] fitted ${fits.fitted} baselines (${fits.failed} without a model) in ${fits.seconds.toFixed(1)} s; loaded region ${scenario.region.name}: ${scenario.installations.length} installations, ` +
      `${scenario.buildings.length} buildings, ${scenario.meters.length} meters, ${scenario.bills.length} bills ` +
      `in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
  return true;
}

/** Whether the demo scenario is loaded (shown on the sign-in page). */
export async function demoLoaded(): Promise<boolean> {
  const db = await getDb();
  const [row] = await db.select({ key: appSetting.key }).from(appSetting).where(eq(appSetting.key, 'demo'));
  return !!row;
}
