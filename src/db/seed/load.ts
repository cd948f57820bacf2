/**
 * Inserts the demo scenario's data (src/db/seed/scenario, documented in docs/demo-scenario.md):
 * region, weather stations and their daily observations, installations with targets, buildings,
 * meters and bills. The accounts are created by src/server/demo.ts through the account service;
 * the field work (kits, loans, flags, walkthroughs), which names people, is loaded after them.
 */
import { inArray } from 'drizzle-orm';
import { bulkInsert } from '../bulk';
import type { Db, Tx } from '../client';
import {
  appSetting,
  building,
  buildingFlag,
  finding,
  installation,
  installationStation,
  instrument,
  kit,
  loan,
  loanEvent,
  measure,
  meter,
  region,
  user,
  walkthrough,
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

/**
 * Inserts the scenario's field work: kits and instruments, shortlist flags, walkthroughs with
 * their findings and measures, loans with their events. Run after the demo accounts exist (people
 * are named by e-mail); ids of walkthroughs, findings, measures, flags and loans come from the
 * scenario. @throws when a person or building it names is missing (a bug in the scenario).
 */
export async function loadFieldData(tx: Db | Tx, s: DemoScenario): Promise<void> {
  const f = s.field;
  const emails = new Set<string>();
  for (const w of f.walkthroughs) {
    emails.add(w.auditor).add(w.createdBy);
    for (const x of w.findings) if (x.measure?.approvedBy) emails.add(x.measure.approvedBy);
  }
  for (const l of f.loans) {
    emails.add(l.requestedBy);
    for (const e of l.events) emails.add(e.by);
  }
  for (const g of f.flags) {
    emails.add(g.flaggedBy);
    if (g.clearedBy) emails.add(g.clearedBy);
  }
  const people = await tx.select({ id: user.id, email: user.email }).from(user).where(inArray(user.email, [...emails]));
  const userId = new Map(people.map((p) => [p.email, p.id]));
  const person = (email: string): string => {
    const id = userId.get(email);
    if (!id) throw new Error(`demo field data names ${email}, who has no account`);
    return id;
  };
  const insts = await tx.select({ id: installation.id, code: installation.code }).from(installation);
  const instId = new Map(insts.map((i) => [i.code, i.id]));
  const blds = await tx.select({ id: building.id, installationId: building.installationId, number: building.number }).from(building);
  const buildingId = (code: string, number: string): string => {
    const b = blds.find((x) => x.installationId === instId.get(code) && x.number === number);
    if (!b) throw new Error(`demo field data names building ${code} ${number}, which is not loaded`);
    return b.id;
  };
  const when = (iso: string | null) => (iso ? new Date(iso) : null);

  const kitRows = await tx
    .insert(kit)
    .values(f.kits.map((k) => ({ code: k.code, name: k.name, description: k.description, homeLocation: k.homeLocation })))
    .returning({ id: kit.id, code: kit.code });
  const kitId = new Map(kitRows.map((k) => [k.code, k.id]));
  await tx.insert(instrument).values(
    f.kits.flatMap((k) => k.instruments.map((i) => ({ kitId: kitId.get(k.code)!, type: i.type, model: i.model, serial: i.serial, calibrationDue: i.calibrationDue, condition: i.condition, notes: i.notes }))),
  );
  await tx.insert(buildingFlag).values(
    f.flags.map((g) => ({
      id: g.id,
      buildingId: buildingId(g.installationCode, g.buildingNumber),
      installationId: instId.get(g.installationCode)!,
      reason: g.reason,
      flaggedBy: person(g.flaggedBy),
      flaggedAt: new Date(g.flaggedAt),
      clearedBy: g.clearedBy ? person(g.clearedBy) : null,
      clearedAt: when(g.clearedAt),
    })),
  );
  await tx.insert(walkthrough).values(
    f.walkthroughs.map((w) => ({
      id: w.id,
      buildingId: buildingId(w.installationCode, w.buildingNumber),
      installationId: instId.get(w.installationCode)!,
      flagId: w.flagId,
      title: w.title,
      plannedOn: w.plannedOn,
      auditorId: person(w.auditor),
      status: w.status,
      form: w.form,
      formVersion: w.status === 'planned' ? 0 : 1,
      createdBy: person(w.createdBy),
      createdAt: new Date(w.createdAt),
      updatedAt: new Date(w.completedAt ?? w.createdAt),
      completedAt: when(w.completedAt),
    })),
  );
  const findings = f.walkthroughs.flatMap((w) => w.findings.map((x) => ({ w, x })));
  if (findings.length > 0) {
    await tx.insert(finding).values(
      findings.map(({ w, x }) => ({
        id: x.id,
        walkthroughId: w.id,
        installationId: instId.get(w.installationCode)!,
        buildingId: buildingId(w.installationCode, w.buildingNumber),
        title: x.title,
        category: x.category,
        location: x.location,
        description: x.description,
        status: x.status,
        createdBy: person(w.auditor),
        createdAt: new Date(x.createdAt),
        updatedAt: new Date(x.createdAt),
      })),
    );
  }
  const measures = findings.flatMap(({ w, x }) => (x.measure ? [{ w, x, m: x.measure }] : []));
  if (measures.length > 0) {
    await tx.insert(measure).values(
      measures.map(({ w, x, m }) => ({
        id: m.id,
        findingId: x.id,
        walkthroughId: w.id,
        installationId: instId.get(w.installationCode)!,
        buildingId: buildingId(w.installationCode, w.buildingNumber),
        title: m.title,
        status: m.status,
        savings: m.savings,
        annualEnergyCostSavings: m.annualEnergyCostSavings,
        annualWaterCostSavings: m.annualWaterCostSavings,
        annualOmCostSavings: m.annualOmCostSavings,
        installedCost: m.installedCost,
        incentives: m.incentives,
        lifeYears: m.lifeYears,
        economics: m.economics,
        approvedBy: m.approvedBy ? person(m.approvedBy) : null,
        approvedAt: when(m.approvedAt),
        implementedOn: m.implementedOn,
        createdBy: person(w.auditor),
        createdAt: new Date(x.createdAt),
        updatedAt: new Date(m.approvedAt ?? x.createdAt),
      })),
    );
  }
  await tx.insert(loan).values(
    f.loans.map((l) => ({
      id: l.id,
      kitId: kitId.get(l.kitCode)!,
      installationId: instId.get(l.installationCode)!,
      walkthroughId: l.walkthroughId,
      requestedBy: person(l.requestedBy),
      purpose: l.purpose,
      startDate: l.startDate,
      endDate: l.endDate,
      status: l.status,
      createdAt: new Date(l.events[0]!.at),
      updatedAt: new Date(l.events[l.events.length - 1]!.at),
    })),
  );
  await tx.insert(loanEvent).values(
    f.loans.flatMap((l) => l.events.map((e) => ({ loanId: l.id, fromStatus: e.fromStatus, toStatus: e.toStatus, userId: person(e.by), actor: e.by, note: e.note, at: new Date(e.at) }))),
  );
}
