/**
 * Inserts the demo scenario's data (src/db/seed/scenario, documented in docs/demo-scenario.md):
 * region, weather stations and their daily observations, installations with targets, buildings,
 * meters and bills. The accounts are created by src/server/demo.ts through the account service.
 */
import { bulkInsert } from '../bulk';
import type { Db, Tx } from '../client';
import {
  appSetting,
  building,
  installation,
  installationStation,
  meter,
  region,
  weatherStation,
} from '../schema';
import type { DemoScenario } from './scenario/types';


/** Inserts the scenario's data rows (not the accounts) in one transaction. */
export async function loadScenarioData(tx: Db | Tx, s: DemoScenario): Promise<void> {
  const [reg] = await tx.insert(region).values(s.region).returning({ id: region.id });
  const stationIds = new Map<string, string>();
  for (const st of s.stations) {
    const [row] = await tx
      .insert(weatherStation)
      .values({ code: st.code, name: st.name, latitude: st.latitude, longitude: st.longitude, elevationFt: st.elevationFt })
      .returning({ id: weatherStation.id });
    stationIds.set(st.code, row!.id);
    await bulkInsert(tx, 'weather_day', [
      { name: 'station_id', type: 'uuid', values: st.days.map(() => row!.id) },
      { name: 'date', type: 'date', values: st.days.map((d) => d.date) },
      { name: 'tmax_f', type: 'float8', values: st.days.map((d) => d.tmaxF) },
      { name: 'tmin_f', type: 'float8', values: st.days.map((d) => d.tminF) },
      { name: 'source', type: 'text', values: st.days.map(() => 'demo') },
    ]);
  }
  const installationIds = new Map<string, string>();
  for (const inst of s.installations) {
    const [row] = await tx
      .insert(installation)
      .values({
        regionId: reg!.id,
        code: inst.code,
        name: inst.name,
        climate: inst.climate,
        timeZone: inst.timeZone,
        targetBaselineFy: inst.target.baselineFy,
        targetReductionPct: inst.target.reductionPct,
        targetFy: inst.target.targetFy,
      })
      .returning({ id: installation.id });
    installationIds.set(inst.code, row!.id);
    await tx.insert(installationStation).values({ installationId: row!.id, stationId: stationIds.get(inst.stationCode)!, primary: true });
  }
  const buildingIds = new Map<string, string>();
  const buildingRows = await tx
    .insert(building)
    .values(
      s.buildings.map((b) => ({
        installationId: installationIds.get(b.installationCode)!,
        number: b.number,
        name: b.name,
        useType: b.useType,
        grossAreaFt2: b.grossAreaFt2,
        yearBuilt: b.yearBuilt,
        occupants: b.occupants,
        lastEvaluatedOn: b.lastEvaluatedOn,
      })),
    )
    .returning({ id: building.id, installationId: building.installationId, number: building.number });
  for (const b of buildingRows) buildingIds.set(`${b.installationId}/${b.number}`, b.id);
  const meterIds = new Map<string, { id: string; installationId: string }>();
  const meterRows = await tx
    .insert(meter)
    .values(
      s.meters.map((m) => {
        const installationId = installationIds.get(m.installationCode)!;
        return {
          installationId,
          buildingId: buildingIds.get(`${installationId}/${m.buildingNumber}`)!,
          code: m.code,
          commodity: m.commodity,
          unit: m.unit,
          account: m.account,
          heatContentKbtuPerUnit: m.heatContentKbtuPerUnit ?? null,
        };
      }),
    )
    .returning({ id: meter.id, installationId: meter.installationId, code: meter.code });
  for (const m of meterRows) meterIds.set(m.code, m);
  // The scenario's deliberate duplicate bill (same meter, same period) cannot be stored twice:
  // the database keeps one bill per meter and period, which is exactly what intake does too.
  const seen = new Set<string>();
  const bills = s.bills.filter((b) => {
    const k = `${b.meterCode}|${b.periodStart}|${b.periodEnd}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
  const meterOf = bills.map((b) => meterIds.get(b.meterCode)!);
  await bulkInsert(tx, 'bill', [
    { name: 'meter_id', type: 'uuid', values: meterOf.map((m) => m.id) },
    { name: 'period_start', type: 'date', values: bills.map((b) => b.periodStart) },
    { name: 'period_end', type: 'date', values: bills.map((b) => b.periodEnd) },
    { name: 'quantity', type: 'float8', values: bills.map((b) => b.quantity) },
    { name: 'unit', type: 'text', values: bills.map((b) => b.unit) },
    { name: 'cost', type: 'float8', values: bills.map((b) => b.cost) },
    { name: 'demand_kw', type: 'float8', values: bills.map((b) => b.demandKw) },
    { name: 'estimated', type: 'bool', values: bills.map((b) => b.estimated) },
  ]);
  await tx
    .insert(appSetting)
    .values({ key: 'demo', value: { loadedAt: new Date().toISOString(), region: s.region.code } })
    .onConflictDoNothing();
}
