/**
 * Benchmarking on the demo region: intensities from bills agree with a hand calculation, the
 * deliberate poor performers top the shortlist for the reasons they were built with, weights move
 * the order as documented, and a flag mails the installation's staff.
 */
import { eq, sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { getDb, queryRows } from '../../src/db/client';
import { mailOutbox } from '../../src/db/schema';
import { loadScenarioData } from '../../src/db/seed/load';
import { generateDemoScenario } from '../../src/db/seed/scenario';
import type { DemoScenario } from '../../src/db/seed/scenario/types';
import { refitBaselines } from '../../src/server/baselines/run';
import { flagBuilding } from '../../src/server/benchmark/flags';
import { computeBuildingMetrics, rollingWindowEnding } from '../../src/server/benchmark/metrics';
import { saveWeights, shortlist, shortlistJson } from '../../src/server/benchmark/shortlist';
import { createUser } from '../../src/server/services/users';
import { actor } from '../support/fixtures';

const AS_OF = '2026-11-30';
let s: DemoScenario;
beforeAll(async () => {
  s = generateDemoScenario({ today: AS_OF });
  const db = await getDb();
  await db.transaction((tx) => loadScenarioData(tx, s));
  await refitBaselines({}, 'test');
  await computeBuildingMetrics({}, AS_OF);
}, 120_000);

const q = { limit: 200, offset: 0, explain: 200 };

describe('intensity', () => {
  it('site EUI of an all-electric building equals its bills over the window × 3.412 / area', async () => {
    // Source: U.S. EIA, Units and calculators explained — 1 kWh = 3,412 Btu.
    const KBTU_PER_KWH = 3.412;
    const elec = new Map(s.meters.map((m) => [m.code, m]));
    const allElectric = s.buildings.find((b) => {
      const ms = s.meters.filter((m) => m.buildingNumber === b.number && m.installationCode === b.installationCode && m.commodity !== 'water');
      return ms.length === 1 && ms[0]!.commodity === 'electricity';
    })!;
    const meter = s.meters.find((m) => m.buildingNumber === allElectric.number && m.installationCode === allElectric.installationCode && m.commodity === 'electricity')!;
    const w = rollingWindowEnding(AS_OF);
    const day = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / 86_400_000;
    // Each bill spread evenly over its inclusive days (methods.md §2); the duplicate bill counted once.
    const seen = new Set<string>();
    let kwh = 0;
    for (const b of s.bills.filter((x) => x.meterCode === meter.code)) {
      const k = `${b.periodStart}|${b.periodEnd}`;
      if (seen.has(k)) continue;
      seen.add(k);
      const s0 = day(b.periodStart);
      const e0 = day(b.periodEnd);
      const overlap = Math.min(e0, w.toDay) - Math.max(s0, w.fromDay) + 1;
      if (overlap > 0) kwh += (b.quantity * overlap) / (e0 - s0 + 1);
    }
    const db = await getDb();
    const [m] = await queryRows<{ site_eui: number }>(db, sql`select m.site_eui from building_metric m join building b on b.id = m.building_id join installation i on i.id = b.installation_id where b.number = ${allElectric.number} and i.code = ${allElectric.installationCode}`);
    expect(m!.site_eui).toBeCloseTo((kwh * KBTU_PER_KWH) / allElectric.grossAreaFt2, 6);
    void elec;
  });
});

describe('the shortlist', () => {
  it('puts the deliberate poor performers at the top, each for the reason it was built with', async () => {
    const manager = await actor('regional_manager');
    const r = await shortlist(manager, q, AS_OF);
    const top5 = r.items.slice(0, 5).map((i) => `${i.installationCode}-${i.buildingNumber}`).sort();
    const poor = s.truth.poorPerformers.map((p) => `${p.installationCode}-${p.buildingNumber}`).sort();
    expect(top5).toEqual(poor);
    const term = (code: string, t: string) => r.items.find((i) => `${i.installationCode}-${i.buildingNumber}` === code)!.breakdown!.terms.find((x) => x.term === t)!;
    for (const p of s.truth.poorPerformers) {
      const code = `${p.installationCode}-${p.buildingNumber}`;
      if (p.kind === 'never-evaluated') expect(term(code, 'evaluationAge').raw, p.reason).toBeNull();
      if (p.kind === 'year-over-year') expect(term(code, 'yoyIncrease').scaled, p.reason).toBeGreaterThan(0.5);
      if (p.kind === 'base-load' || p.kind === 'heating' || p.kind === 'water-leak') expect(term(code, 'excessEnergy').scaled, p.reason).toBeGreaterThan(0.5);
      expect(r.items.find((i) => `${i.installationCode}-${i.buildingNumber}` === code)!.breakdown!.explanation.join(' ')).toMatch(/CBECS 2018|evaluat|rose/);
    }
  });

  it('weights change the order as documented: all weight on the evaluation age ranks by years since the last evaluation', async () => {
    const manager = await actor('regional_manager');
    await saveWeights(manager, { excessEnergy: 0, excessCost: 0, yoyIncrease: 0, anomalies: 0, evaluationAge: 1, manualFlag: 0 });
    try {
      const r = await shortlist(manager, q, AS_OF);
      // Four-year evaluation cycle (EISA 2007 §432): never, or 4+ years ago, scores the full 100.
      const years = (d: string | null) => (d === null ? Infinity : (Date.parse(AS_OF) - Date.parse(d)) / (365.25 * 86_400_000));
      for (const i of r.items) {
        if (years(i.lastEvaluatedOn) >= 4) expect(i.score).toBeCloseTo(100, 9);
        else expect(i.score).toBeCloseTo((100 * years(i.lastEvaluatedOn)) / 4, 6);
      }
      for (let k = 1; k < r.items.length; k++) expect(r.items[k - 1]!.score).toBeGreaterThanOrEqual(r.items[k]!.score);
      // Ties at 100 are broken by excess energy, then building number (documented order).
      const tied = r.items.filter((i) => i.score > 99.999999);
      expect(tied.length).toBeGreaterThan(5);
      for (let k = 1; k < tied.length; k++) expect(tied[k - 1]!.excessKbtu).toBeGreaterThanOrEqual(tied[k]!.excessKbtu);
    } finally {
      await saveWeights(manager, { excessEnergy: 30, excessCost: 20, yoyIncrease: 15, anomalies: 10, evaluationAge: 15, manualFlag: 10 });
    }
  });

  it('a flag raises the building and mails its installation staff', async () => {
    const manager = await actor('regional_manager');
    await createUser(null, { email: 'ksl.staff@example.test', name: 'Kestrowe Staff', role: 'installation_staff', installations: ['KSL'] }, 'a long enough passphrase');
    const before = await shortlist(manager, q, AS_OF);
    const target = before.items.find((i) => i.installationCode === 'KSL' && i.rank > 20)!;
    const f = await flagBuilding(manager, { buildingId: target.buildingId, reason: 'Night-time boiler cycling reported by the fire watch' });
    expect(f.notified).toContain('ksl.staff@example.test');
    const after = await shortlist(manager, q, AS_OF);
    const moved = after.items.find((i) => i.buildingId === target.buildingId)!;
    expect(moved.rank).toBeLessThan(target.rank);
    expect(moved.flag?.reason).toMatch(/boiler cycling/);
    const db = await getDb();
    const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'ksl.staff@example.test'));
    expect(mails.some((m) => m.subject.includes(`building ${target.buildingNumber}`) && m.text.includes('boiler cycling'))).toBe(true);
    await expect(flagBuilding(manager, { buildingId: target.buildingId, reason: 'twice is refused' })).rejects.toMatchObject({ status: 409 });
  });

  it('installation staff rank only their own installation', async () => {
    const db = await getDb();
    const [ksl] = await queryRows<{ id: string }>(db, sql`select id from installation where code = 'KSL'`);
    const staff = await actor('installation_staff', [ksl!.id]);
    const r = await shortlist(staff, q, AS_OF);
    expect(new Set(r.items.map((i) => i.installationCode))).toEqual(new Set(['KSL']));
    expect(r.items[0]!.rank).toBe(1);
  });
});

describe('the cached ranking', () => {
  const counter = async () => {
    const db = await getDb();
    const [r] = await queryRows<{ v: string }>(db, sql`select version::text as v from change_counter where topic = 'ranking'`);
    return Number(r!.v);
  };

  it('is raised by a change to what the ranking reads, and not by a bill import moving a meter\'s last bill date', async () => {
    const db = await getDb();
    const v0 = await counter();
    await db.execute(sql`update meter set last_bill_end = last_bill_end where code = (select min(code) from meter)`);
    expect(await counter()).toBe(v0);
    await db.execute(sql`update meter set active = active where code = (select min(code) from meter)`);
    expect(await counter()).toBe(v0 + 1);
    await db.execute(sql`update building set name = name where number = (select min(number) from building)`);
    expect(await counter()).toBe(v0 + 2);
  });

  it('a change rolled back leaves the counter as it was', async () => {
    const db = await getDb();
    const v0 = await counter();
    await expect(
      db.transaction(async (tx) => {
        await tx.execute(sql`update building set name = name`);
        throw new Error('abandon');
      }),
    ).rejects.toThrow('abandon');
    expect(await counter()).toBe(v0);
  });

  it('answers the same bytes until something changes, then the new ranking', async () => {
    const manager = await actor('regional_manager');
    const query = { limit: 5000, offset: 0, explain: 0 };
    const a = await shortlistJson(manager, query, AS_OF);
    const b = await shortlistJson(manager, query, AS_OF);
    expect(b).toBe(a);
    const parsed = JSON.parse(new TextDecoder().decode(a)) as Awaited<ReturnType<typeof shortlist>>;
    const last = parsed.items.at(-1)!;
    expect(last.flag).toBeNull();
    await flagBuilding(manager, { buildingId: last.buildingId, reason: 'Steam plume from the roof vent seen by the night shift' });
    const c = JSON.parse(new TextDecoder().decode(await shortlistJson(manager, query, AS_OF))) as typeof parsed;
    const moved = c.items.find((i) => i.buildingId === last.buildingId)!;
    expect(moved.flag?.reason).toMatch(/Steam plume/);
    expect(moved.rank).toBeLessThan(last.rank);
  });
});
