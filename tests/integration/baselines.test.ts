/**
 * Portfolio fits on the demo region: every meter gets a model or a typed reason; the stated
 * parameters the demo bills were generated from are recovered within their noise; the retrofit
 * and the poor performers show in the statistics; the analyst's decisions and the baseline period
 * behave as documented. (The demo data are invented: these checks test the engine against the
 * generator's stated truth, not against a published value.)
 */
import { sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb, queryRows } from '../../src/db/client';
import { loadScenarioData } from '../../src/db/seed/load';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import type { DemoScenario } from '../../src/db/seed/scenario/types';
import { refitBaselines } from '../../src/server/baselines/run';
import { decide, getBaseline, listBaselines, setPeriod } from '../../src/server/baselines/service';
import { actor } from '../support/fixtures';

let scenario: DemoScenario;
interface Row { code: string; status: string; shape: string | null; reason: string | null; cvrmse: number | null; fit: any; meter_id: string }
let rows: Row[];
beforeAll(async () => {
  scenario = generateDemoScenario({ today: '2026-11-30' });
  const db = await getDb();
  await db.transaction((tx) => loadScenarioData(tx, scenario));
  const r = await refitBaselines({}, 'test', { workers: 2 });
  expect(r.fitted + r.failed).toBe(scenario.meters.length);
  rows = await queryRows<Row>(db, sql`select m.code, b.status, b.shape, b.reason, b.cvrmse, b.fit, b.meter_id from baseline b join meter m on m.id = b.meter_id`);
}, 120_000);

const byCode = (code: string) => rows.find((r) => r.code === code)!;
const changed = () => new Set([scenario.truth.retrofit.meterCode, ...scenario.truth.poorPerformers.map((p) => p.meterCode)]);

describe('portfolio fit of the demo region', () => {
  it('every meter has a model or a typed reason, and no statistic is NaN', () => {
    expect(rows.length).toBe(scenario.meters.length);
    for (const r of rows) {
      if (r.status === 'insufficient-data' && !r.shape) expect(r.reason).toMatch(/^[a-z-]+$/);
      else expect(r.shape).toMatch(/^(mean|heating|cooling|heating-cooling|linear)$/);
      expect(JSON.stringify(r.fit)).not.toMatch(/NaN|Infinity/);
    }
  });

  it('recovers the heating slopes the bills were generated from, within their noise', () => {
    const heating = Object.entries(scenario.truth.meters).filter(([code, t]) => t.heatingSlope > 0 && t.coolingSlope === 0 && !changed().has(code));
    expect(heating.length).toBeGreaterThan(40);
    let within = 0;
    for (const [code, t] of heating) {
      const m = byCode(code).fit.selected;
      if (m?.heatingSlope && Math.abs(m.heatingSlope / t.heatingSlope - 1) <= 0.2) within++;
    }
    // With 5-10 % noise per bill and 36 bills, nearly every slope should land within 20 %.
    expect(within / heating.length).toBeGreaterThanOrEqual(0.85);
  });

  it('recovers base loads within their noise for weather-sensitive electricity', () => {
    const cooling = Object.entries(scenario.truth.meters).filter(([code, t]) => t.coolingSlope > 0 && t.heatingSlope === 0 && t.unit === 'kWh' && !changed().has(code));
    let within = 0;
    for (const [code, t] of cooling) {
      const m = byCode(code).fit.selected;
      if (m && Math.abs(m.intercept / t.basePerDay - 1) <= 0.15) within++;
    }
    expect(within / cooling.length).toBeGreaterThanOrEqual(0.85);
  });

  it('the poor performers show: base load and heating slope per square foot well above buildings of their type', () => {
    const perFt2 = (code: string, key: 'intercept' | 'heatingSlope') => {
      const meter = scenario.meters.find((m) => m.code === code)!;
      const b = scenario.buildings.find((x) => x.number === meter.buildingNumber && x.installationCode === meter.installationCode)!;
      const v = byCode(code).fit.selected?.[key] ?? 0;
      return { v: v / b.grossAreaFt2, useType: b.useType, commodity: meter.commodity, unit: meter.unit };
    };
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    for (const p of scenario.truth.poorPerformers.filter((x) => x.kind === 'base-load' || x.kind === 'heating')) {
      const key = p.kind === 'base-load' ? 'intercept' : 'heatingSlope';
      const me = perFt2(p.meterCode, key);
      const peers = scenario.meters
        .filter((m) => m.code !== p.meterCode && m.unit === me.unit && !changed().has(m.code))
        .map((m) => perFt2(m.code, key))
        .filter((x) => x.useType === me.useType && x.v > 0)
        .map((x) => x.v);
      expect(peers.length, p.reason).toBeGreaterThan(0);
      expect(me.v, p.reason).toBeGreaterThan(1.5 * median(peers));
    }
  });

  it('the retrofit shows: a fit across it is worse than fits on either side, which recover the stated slopes', async () => {
    const rf = scenario.truth.retrofit;
    const across = byCode(rf.meterCode);
    const analyst = await actor('analyst');
    const meterId = across.meter_id;
    const date = rf.date;
    const before = await setPeriod(analyst, { meterId, start: '2022-11-01', end: addDays(date, -1), note: 'the years before the boiler replacement' });
    const beforeFit = (before.fit as any).selected;
    // Source: the demo's stated truth (docs/demo-scenario.md, The retrofit).
    expect(Math.abs(beforeFit.heatingSlope / rf.before.heatingSlope - 1)).toBeLessThan(0.15);
    expect(before.cvrmse!).toBeLessThan(across.cvrmse!);
    const after = await setPeriod(analyst, { meterId, start: date, end: '2026-11-30', note: 'after the replacement' });
    expect(Math.abs((after.fit as any).selected.heatingSlope / rf.after.heatingSlope - 1)).toBeLessThan(0.2);
    expect(after.cvrmse!).toBeLessThan(across.cvrmse!);
  });
});

describe('decisions', () => {
  it('accept keeps its status through a refit on unchanged data; a data change sends it back to review', async () => {
    const analyst = await actor('analyst');
    const r = rows.find((x) => x.status === 'needs-review' && x.code.endsWith('-E'))!;
    const accepted = await decide(analyst, { meterId: r.meter_id, action: 'accept', note: 'looks right: clear cooling response' });
    expect(accepted.status).toBe('accepted');
    expect(accepted.decisions[0]).toMatchObject({ action: 'accept', note: 'looks right: clear cooling response' });
    await refitBaselines({ meterIds: [r.meter_id] }, 'test');
    expect((await getBaseline(analyst, r.meter_id)).status).toBe('accepted');
    const db = await getDb();
    await db.execute(sql`update bill set quantity = quantity * 1.3 where meter_id = ${r.meter_id} and period_start = (select max(period_start) from bill where meter_id = ${r.meter_id})`);
    await refitBaselines({ meterIds: [r.meter_id] }, 'test');
    expect((await getBaseline(analyst, r.meter_id)).status).not.toBe('accepted');
  });

  it('override picks another shape, recorded with its note; a shape without a model is refused', async () => {
    const analyst = await actor('analyst');
    const r = rows.find((x) => x.fit.ok && x.shape !== 'mean' && x.fit.shapes?.mean?.ok)!;
    const o = await decide(analyst, { meterId: r.meter_id, action: 'override', shape: 'mean', note: 'weather response not credible here' });
    expect(o).toMatchObject({ status: 'accepted', shape: 'mean', overrideShape: 'mean' });
    expect(o.decisions[0]).toMatchObject({ action: 'override', shape: 'mean' });
    const noModel = rows.find((x) => x.fit.ok && x.fit.shapes && Object.values(x.fit.shapes).some((s: any) => !s.ok))!;
    const missing = Object.entries(noModel.fit.shapes).find(([, s]: [string, any]) => !s.ok)![0] as 'heating';
    await expect(decide(analyst, { meterId: noModel.meter_id, action: 'override', shape: missing, note: 'try it' })).rejects.toMatchObject({ status: 409 });
  });

  it('lists by status with counts, within scope', async () => {
    const staff = await actor('installation_staff', []);
    expect((await listBaselines(staff)).items).toEqual([]);
    const a = await actor('analyst');
    const all = await listBaselines(a);
    expect(Object.values(all.counts).reduce((x, y) => x + y, 0)).toBe(scenario.meters.length);
    const accepted = await listBaselines(a, { status: 'accepted' });
    expect(accepted.items.every((i) => i.status === 'accepted')).toBe(true);
  });
});

function addDays(iso: string, n: number): string {
  return new Date(Date.parse(`${iso}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
}
