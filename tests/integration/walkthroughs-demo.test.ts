/**
 * Instrument suggestions and verified savings on the demo region, checked against the faults the
 * scenario generator states it built in (docs/demo-scenario.md): the base-load, heating and water
 * poor performers, and the boiler retrofit partway through. The demo data are invented: these
 * checks test the signature reading and the savings assembly against the generator's stated truth.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { getDb } from '../../src/db/client';
import { building, installation } from '../../src/db/schema';
import { loadScenarioData } from '../../src/db/seed/load';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import type { DemoScenario } from '../../src/db/seed/scenario/types';
import { refitBaselines } from '../../src/server/baselines/run';
import { computeBuildingMetrics } from '../../src/server/benchmark/metrics';
import { saveMeasure, setMeasureStatus } from '../../src/server/measures/service';
import { buildingVerifiedSavings } from '../../src/server/measures/verified-savings';
import { createFinding } from '../../src/server/walkthroughs/findings';
import { planWalkthrough } from '../../src/server/walkthroughs/service';
import { suggestionsForBuilding } from '../../src/server/walkthroughs/signature';
import type { Actor } from '../../src/server/authz';
import { actor } from '../support/fixtures';
import { and } from 'drizzle-orm';

const AS_OF = '2026-11-30';
let s: DemoScenario;
let manager: Actor;

async function buildingId(code: string, number: string): Promise<string> {
  const db = await getDb();
  const [b] = await db.select({ id: building.id }).from(building).innerJoin(installation, eq(installation.id, building.installationId)).where(and(eq(installation.code, code), eq(building.number, number)));
  return b!.id;
}

beforeAll(async () => {
  s = generateDemoScenario({ today: AS_OF });
  const db = await getDb();
  await db.transaction((tx) => loadScenarioData(tx, s));
  await refitBaselines({}, 'test', { workers: 2 });
  await computeBuildingMetrics({}, AS_OF);
  manager = await actor('regional_manager');
}, 180_000);

describe('instrument suggestions on the demo poor performers', () => {
  const poor = (kind: string) => s.truth.poorPerformers.find((p) => p.kind === kind)!;

  it('the base-load building gets the plug-in power meter and clamp ammeter, for its base load', async () => {
    const p = poor('base-load');
    const r = await suggestionsForBuilding(manager, await buildingId(p.installationCode, p.buildingNumber));
    const meter = r.instruments.find((i) => i.type === 'plug_in_power_meter');
    expect(meter?.basis).toBe('signature');
    expect(meter!.reasons[0]).toMatch(/^Electric base load .* is \d+\.\d× the median of \d+ buildings of type Office/);
    expect(r.instruments.map((i) => i.type)).toContain('clamp_ammeter');
  });

  it('the oil-heated lodging with a steep heating slope gets the infrared camera and the combustion analyzer', async () => {
    const p = poor('heating');
    const r = await suggestionsForBuilding(manager, await buildingId(p.installationCode, p.buildingNumber));
    expect(r.instruments.find((i) => i.type === 'infrared_camera')!.reasons.join(' ')).toMatch(/Heating (slope .* Btu\/ft²·HDD|fuel at normal weather .* kBtu\/ft²·yr) is \d+\.\d× the median/);
    expect(r.instruments.find((i) => i.type === 'combustion_analyzer')!.reasons.join(' ')).toMatch(/fuel-fired heating/);
    // Its heating starts at 66 °F (the generator's stated balance point).
    expect(r.signature.heatingBalanceF).toBeGreaterThanOrEqual(65);
  });

  it('the dining facility with hot-water leaks gets flow-test bags', async () => {
    const p = poor('water-leak');
    const r = await suggestionsForBuilding(manager, await buildingId(p.installationCode, p.buildingNumber));
    expect(r.instruments.find((i) => i.type === 'flow_test_bags')!.reasons[0]).toMatch(/^Water use .* gal\/ft²·yr is \d+\.\d× the median/);
  });
});

describe('verified savings of the demo retrofit', () => {
  it('recovers the avoided gas the generator built in (heating slope drop), within the 90 % uncertainty', async () => {
    const rt = s.truth.retrofit;
    const id = await buildingId(rt.installationCode, rt.buildingNumber);
    const dayBefore = new Date(Date.parse(rt.date) - 30 * 86_400_000).toISOString().slice(0, 10);
    const w = await planWalkthrough(manager, { buildingId: id, title: 'Boiler plant', plannedOn: dayBefore, auditorId: null });
    const f = await createFinding(await actor('admin'), w.id, { title: rt.measure.slice(0, 190), category: 'hvac', location: 'Boiler room', description: '' });
    const m = await saveMeasure(manager, f.id, { savings: [{ commodity: 'natural_gas', quantity: 1, unit: rt.before.unit as 'therm' }], annualEnergyCostSavings: 1, annualWaterCostSavings: 0, annualOmCostSavings: 0, installedCost: 100_000, incentives: 0, lifeYears: 25, energyEscalationPercent: 0 });
    await setMeasureStatus(manager, m.id, { status: 'approved', note: '' });
    await setMeasureStatus(manager, m.id, { status: 'implemented', implementedOn: rt.date, note: '' });
    const r = await buildingVerifiedSavings(manager, id);
    const line = r.lines.find((l) => l.meterCode === rt.meterCode)!;
    if (!line.result.ok) throw new Error(line.result.detail);
    // Truth: Σ over the reporting bills' days of (βH before − βH after)·HDD(τH), on the scenario's own weather.
    const station = s.stations.find((x) => x.code === s.installations.find((i) => i.code === rt.installationCode)!.stationCode)!;
    const mean = new Map(station.days.map((d) => [d.date, d.tmaxF !== null && d.tminF !== null ? (d.tmaxF + d.tminF) / 2 : null]));
    let truth = 0;
    for (const p of line.result.reporting.periods) {
      for (let t = Date.parse(p.start); t <= Date.parse(p.end); t += 86_400_000) {
        const T = mean.get(new Date(t).toISOString().slice(0, 10));
        if (T !== null && T !== undefined) truth += (rt.before.heatingSlope - rt.after.heatingSlope) * Math.max(0, rt.before.heatingBalanceF! - T);
      }
    }
    const u90 = line.result.uncertainty.find((u) => u.confidence === 0.9)!;
    expect(line.result.reporting.periods.length).toBeGreaterThanOrEqual(12);
    expect(line.result.avoidedUse).toBeGreaterThan(0);
    expect(Math.abs(line.result.avoidedUse - truth)).toBeLessThanOrEqual(u90.plusMinus!);
  });
});
