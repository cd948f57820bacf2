/**
 * Measures on a small invented inventory: economics stored with the discount rate used (checked
 * against the standard annuity factors (P/A, 3 %, 10) = 8.5302 and (P/A, 7 %, 10) = 7.0236 and the
 * UConn ITAC payback example), the status path with its permissions and log, roll-ups, and verified
 * savings on a constructed building whose heating slope drops at a known date (avoided use checked
 * against CalTRACK 2.0 §3.6 evaluated on the constructed weather).
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '../../src/db/client';
import { baseline, bill, installationStation, meter, weatherDay, weatherStation } from '../../src/db/schema';
import type { Actor } from '../../src/server/authz';
import { refitBaselines } from '../../src/server/baselines/run';
import { currentDiscountRate, setDiscountRate } from '../../src/server/measures/discount-rate';
import { installationRollups } from '../../src/server/measures/rollup';
import { getMeasure, saveMeasure, setMeasureStatus } from '../../src/server/measures/service';
import { buildingVerifiedSavings } from '../../src/server/measures/verified-savings';
import { createFinding } from '../../src/server/walkthroughs/findings';
import { getWalkthrough, planWalkthrough } from '../../src/server/walkthroughs/service';
import { actor, twoInstallations } from '../support/fixtures';
import { rejects } from './walkthroughs-support';

const UPV_3_10 = 8.5302; // (P/A, 3 %, 10), standard compound-interest tables
const UPV_7_10 = 7.0236; // (P/A, 7 %, 10), standard compound-interest tables

let inv: Awaited<ReturnType<typeof twoInstallations>>;
let manager: Actor;
let staffA: Actor;
let auditorA: Actor;
let auditorB: Actor;
let walkId: string;


const itac = { savings: [{ commodity: 'natural_gas' as const, quantity: 4000, unit: 'therm' as const }], annualEnergyCostSavings: 4000, annualWaterCostSavings: 0, annualOmCostSavings: 0, installedCost: 12_000, incentives: 2_000, lifeYears: 10, energyEscalationPercent: 0 };

beforeAll(async () => {
  inv = await twoInstallations();
  manager = await actor('regional_manager');
  staffA = await actor('installation_staff', [inv.a.id]);
  auditorA = await actor('auditor', [inv.a.id]);
  auditorB = await actor('auditor', [inv.b.id]);
  walkId = (await planWalkthrough(manager, { buildingId: inv.buildingA.id, title: 'Alpha HQ walk', plannedOn: '2022-12-01', auditorId: auditorA.id })).id;
});

describe('economics stored with the discount rate used', () => {
  it('computes at the rate in force (the 3 % default) and keeps that rate with the measure', async () => {
    expect(await currentDiscountRate()).toMatchObject({ realDiscountRatePercent: 3, setAt: null });
    const f = await createFinding(auditorA, walkId, { title: 'Boiler short-cycling', category: 'hvac', location: 'Boiler room', description: '' });
    const m = await saveMeasure(auditorA, f.id, itac);
    expect(m.status).toBe('proposed');
    expect(m.economics!.rate).toMatchObject({ realDiscountRatePercent: 3, effectiveFrom: '2010-04-01', setAt: null });
    expect(m.economics!.result.simplePaybackYears).toBeCloseTo(2.5, 12); // Source: UConn ITAC training notes, ($12,000 − $2,000) / $4,000
    expect(m.economics!.result.upv).toBeCloseTo(UPV_3_10, 4);
    expect(m.economics!.result.pvSavingsUsd).toBeCloseTo(4000 * UPV_3_10, 0);
  });

  it('a new rate applies when figures are saved again; a decided measure keeps the rate it was approved at', async () => {
    const f1 = await createFinding(auditorA, walkId, { title: 'Approved early', category: 'lighting', location: '', description: '' });
    const early = await saveMeasure(auditorA, f1.id, itac);
    await setMeasureStatus(manager, early.id, { status: 'approved', note: 'go' });
    expect((await rejects(setDiscountRate(auditorA, { realDiscountRatePercent: 7, effectiveFrom: '2026-04-01', source: 'test' }))).status).toBe(403);
    const rate = await setDiscountRate(manager, { realDiscountRatePercent: 7, effectiveFrom: '2026-04-01', source: 'Set for the test' });
    expect(rate).toMatchObject({ realDiscountRatePercent: 7, effectiveFrom: '2026-04-01', setAt: expect.any(String) });
    const f2 = await createFinding(auditorA, walkId, { title: 'Priced after the change', category: 'lighting', location: '', description: '' });
    const later = await saveMeasure(auditorA, f2.id, itac);
    expect(later.economics!.rate.realDiscountRatePercent).toBe(7);
    expect(later.economics!.result.upv).toBeCloseTo(UPV_7_10, 4);
    expect((await getMeasure(manager, early.id)).economics!.rate.realDiscountRatePercent).toBe(3);
    // Figures of a decided measure are kept as decided.
    expect((await rejects(saveMeasure(auditorA, f1.id, { ...itac, installedCost: 1 }))).details).toMatchObject({ reason: 'measure-decided' });
    await setDiscountRate(manager, { realDiscountRatePercent: 3, effectiveFrom: '2010-04-01', source: 'back to the default for the other tests' });
  });

  it('names the measure field when the economics refuse the figures (incentives above the cost)', async () => {
    const f = await createFinding(auditorA, walkId, { title: 'Bad figures', category: 'other', location: '', description: '' });
    const e = await rejects(saveMeasure(auditorA, f.id, { ...itac, incentives: 20_000 }));
    expect(e.status).toBe(400);
    expect(e.details).toEqual([{ field: 'incentives', message: 'Incentives and rebates ($) must not exceed the installed cost' }]);
  });
});

describe('status path', () => {
  it('proposed → approved (managers only) → implemented (dated, not before the walkthrough, not in the future), each move logged', async () => {
    const f = await createFinding(auditorA, walkId, { title: 'Path', category: 'hvac', location: '', description: '' });
    const m = await saveMeasure(auditorA, f.id, itac);
    expect((await rejects(setMeasureStatus(auditorA, m.id, { status: 'approved', note: '' }))).status).toBe(403);
    expect((await rejects(setMeasureStatus(manager, m.id, { status: 'implemented', implementedOn: '2023-01-01', note: '' }))).status).toBe(409);
    const approved = await setMeasureStatus(manager, m.id, { status: 'approved', note: 'fund from FY27 O&M' });
    expect(approved).toMatchObject({ status: 'approved', approvedBy: manager.id });
    expect((await rejects(setMeasureStatus(staffA, m.id, { status: 'implemented', implementedOn: '2022-11-30', note: '' }))).status).toBe(422);
    expect((await rejects(setMeasureStatus(staffA, m.id, { status: 'implemented', implementedOn: '2099-01-01', note: '' }))).status).toBe(422);
    const done = await setMeasureStatus(staffA, m.id, { status: 'implemented', implementedOn: '2022-12-22', note: 'contractor finished' });
    expect(done).toMatchObject({ status: 'implemented', implementedOn: '2022-12-22' });
    const h = (await getMeasure(staffA, m.id)).history;
    expect(h.map((x) => [x.action, x.details.from ?? null, x.details.to ?? null])).toEqual([
      ['measure.create', null, null],
      ['measure.status', 'proposed', 'approved'],
      ['measure.status', 'approved', 'implemented'],
    ]);
    expect(h[1]!.details.note).toBe('fund from FY27 O&M');
    expect((await rejects(getMeasure(auditorB, m.id))).status).toBe(404);
  });
});

describe('roll-ups', () => {
  it('per walkthrough and per installation: counts by status, totals and the portfolio payback', async () => {
    const w = await getWalkthrough(manager, walkId);
    const ms = w.findings.flatMap((f) => (f.measure ? [f.measure] : []));
    expect(w.rollup.count).toBe(ms.length);
    const inPlay = ms.filter((m) => m.status !== 'rejected');
    expect(w.rollup.inPlay.installedCost).toBe(inPlay.reduce((s, m) => s + m.installedCost, 0));
    // Every measure here is the ITAC example: the bundle pays back in 2.5 years too.
    expect(w.rollup.inPlay.simplePaybackYears).toBeCloseTo(2.5, 12);
    const [aaa] = await installationRollups(manager, 'AAA');
    expect(aaa!.measures.count).toBe(ms.length);
    expect(aaa!.walkthroughs.planned).toBe(1);
    expect(await installationRollups(staffA)).toHaveLength(1);
  });
});

describe('verified savings on a constructed building with a known step change', () => {
  // Daily mean 50 ± 30 °F (a constructed annual cycle), gas use 100 + 5·HDD65 therm/day, 3·HDD65 from bill 24 on.
  const first = Date.UTC(2021, 0, 1) / 86_400_000;
  const meanF = (d: number) => 50 - 30 * Math.cos((2 * Math.PI * (d - first)) / 365);
  const hdd = (d: number) => Math.max(0, 65 - meanF(d));
  const iso = (d: number) => new Date(d * 86_400_000).toISOString().slice(0, 10);
  const implDay = first + 30 * 24;
  let gasId: string;
  let measureId: string;

  beforeAll(async () => {
    const db = await getDb();
    const [st] = await db.insert(weatherStation).values({ code: 'AAAWX', name: 'Alpha field' }).returning();
    await db.insert(installationStation).values({ installationId: inv.a.id, stationId: st!.id, primary: true });
    await db.insert(weatherDay).values(Array.from({ length: 36 * 30 + 10 }, (_, i) => ({ stationId: st!.id, date: iso(first + i), tmaxF: meanF(first + i) + 5, tminF: meanF(first + i) - 5, source: 'file' })));
    const [gas] = await db.insert(meter).values({ installationId: inv.a.id, buildingId: inv.buildingA.id, code: 'AAA-100-G', commodity: 'natural_gas', unit: 'therm' }).returning();
    gasId = gas!.id;
    await db.insert(bill).values(
      Array.from({ length: 36 }, (_, i) => {
        const s = first + 30 * i;
        let q = 0;
        for (let d = s; d < s + 30; d++) q += 100 + (d < implDay ? 5 : 3) * hdd(d);
        return { meterId: gasId, periodStart: iso(s), periodEnd: iso(s + 29), quantity: q, unit: 'therm' };
      }),
    );
    const f = await createFinding(auditorA, walkId, { title: 'Boiler replacement', category: 'hvac', location: 'Boiler room', description: '' });
    measureId = (await saveMeasure(auditorA, f.id, itac)).id;
    await setMeasureStatus(manager, measureId, { status: 'approved', note: '' });
    await setMeasureStatus(manager, measureId, { status: 'implemented', implementedOn: iso(implDay), note: '' });
  });

  const expectedAvoided = () => {
    let x = 0;
    for (let d = implDay; d < first + 36 * 30; d++) x += 2 * hdd(d); // (5 − 3) therm per HDD65
    return x;
  };

  it('refits the meter on the bills before the date when no stored baseline ends before it', async () => {
    const r = await buildingVerifiedSavings(staffA, inv.buildingA.id);
    const line = r.lines.find((l) => l.measureId === measureId && l.meterId === gasId)!;
    expect(line.estimatedAnnual).toBe(4000);
    if (!line.result.ok) throw new Error(line.result.detail);
    expect(line.result.baseline.source).toBe('refit');
    expect(line.result.reporting.periods).toHaveLength(12);
    expect(line.result.avoidedUse).toBeCloseTo(expectedAvoided(), 3);
    expect((await rejects(buildingVerifiedSavings(auditorB, inv.buildingA.id))).status).toBe(404);
  });

  it('uses the stored baseline when the analyst’s period ends before the date', async () => {
    const db = await getDb();
    await db.insert(baseline).values({ meterId: gasId, buildingId: inv.buildingA.id, installationId: inv.a.id, commodity: 'natural_gas', unit: 'therm', status: 'needs-review', periodStart: iso(first), periodEnd: iso(implDay - 1), periodChosen: true });
    await refitBaselines({ meterIds: [gasId] }, 'test', { workers: 1 });
    const [bl] = await db.select({ shape: baseline.shape, periodEnd: baseline.periodEnd }).from(baseline).where(eq(baseline.meterId, gasId));
    expect(bl).toEqual({ shape: 'heating', periodEnd: iso(implDay - 1) });
    const r = await buildingVerifiedSavings(staffA, inv.buildingA.id);
    const line = r.lines.find((l) => l.measureId === measureId && l.meterId === gasId)!;
    if (!line.result.ok) throw new Error(line.result.detail);
    expect(line.result.baseline.source).toBe('stored');
    expect(line.result.avoidedUse).toBeCloseTo(expectedAvoided(), 3);
  });
});
