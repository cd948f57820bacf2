/**
 * The demo's field work (kits, loans, flags, walkthroughs) as the generator returns it: complete,
 * consistent with the rest of the scenario, and priced with published arithmetic.
 */
import { describe, expect, it } from 'vitest';
import { generateDemoScenario } from '../../../src/db/seed/scenario';
import { HOLDING_LOAN_STATUSES } from '../../../src/db/seed/scenario/field-types';
import { INSTRUMENT_TYPES } from '../../../src/lib/field/instruments';

const s = generateDemoScenario();
const f = s.field;
const holding = new Set<string>(HOLDING_LOAN_STATUSES);

// The loan life cycle of the issue: requested → approved → shipped → in use → returned → inspected,
// with declined (from requested) and cancelled (before it ships). Common practice for a lending desk.
const NEXT: Record<string, string[]> = {
  requested: ['approved', 'declined', 'cancelled'],
  approved: ['shipped', 'cancelled'],
  shipped: ['in-use'],
  'in-use': ['returned'],
  returned: ['inspected'],
};

describe('demo kits', () => {
  it('4–6 kits that together carry every instrument type', () => {
    expect(f.kits.length).toBeGreaterThanOrEqual(4);
    expect(f.kits.length).toBeLessThanOrEqual(6);
    expect(new Set(f.kits.flatMap((k) => k.instruments.map((i) => i.type)))).toEqual(new Set(INSTRUMENT_TYPES));
    expect(new Set(f.kits.map((k) => k.code)).size).toBe(f.kits.length);
    expect(new Set(f.kits.map((k) => k.homeInstallationCode)).size).toBeGreaterThanOrEqual(4);
  });

  it('one instrument past calibration and a few due within 30 days of today', () => {
    const due = f.kits.flatMap((k) => k.instruments).flatMap((i) => (i.calibrationDue ? [i.calibrationDue] : []));
    expect(due.filter((d) => d < '2026-11-30')).toHaveLength(1);
    expect(due.filter((d) => d >= '2026-11-30' && d <= '2026-12-30').length).toBeGreaterThanOrEqual(2);
  });
});

describe('demo loans', () => {
  it('each history follows the loan life cycle and ends in the loan’s status', () => {
    for (const l of f.loans) {
      expect(l.events[0]!.fromStatus).toBeNull();
      expect(l.events[0]!.toStatus).toBe('requested');
      for (let i = 1; i < l.events.length; i++) {
        expect(l.events[i]!.fromStatus).toBe(l.events[i - 1]!.toStatus);
        expect(NEXT[l.events[i - 1]!.toStatus], `${l.kitCode} ${l.startDate}`).toContain(l.events[i]!.toStatus);
        expect(l.events[i]!.at > l.events[i - 1]!.at).toBe(true);
      }
      expect(l.events.at(-1)!.toStatus).toBe(l.status);
      expect(l.endDate >= l.startDate).toBe(true);
    }
  });

  it('past loans were returned and inspected; one is in use today; one is requested', () => {
    expect(f.loans.filter((l) => l.status === 'inspected').length).toBeGreaterThanOrEqual(3);
    const inUse = f.loans.filter((l) => l.status === 'in-use');
    expect(inUse).toHaveLength(1);
    expect(inUse[0]!.startDate <= '2026-11-30' && '2026-11-30' <= inUse[0]!.endDate).toBe(true);
    expect(f.loans.filter((l) => l.status === 'requested')).toHaveLength(1);
  });

  it('no two loans holding one kit overlap, and no holding loan carries an instrument past calibration', () => {
    const held = f.loans.filter((l) => holding.has(l.status));
    for (const a of held) {
      for (const b of held) {
        if (a === b || a.kitCode !== b.kitCode) continue;
        expect(a.endDate < b.startDate || b.endDate < a.startDate).toBe(true);
      }
      const kit = f.kits.find((k) => k.code === a.kitCode)!;
      for (const i of kit.instruments) if (i.calibrationDue) expect(i.calibrationDue >= a.endDate, `${kit.code} ${i.type}`).toBe(true);
    }
  });
});

describe('demo walkthroughs', () => {
  const completed = f.walkthroughs.filter((w) => w.status === 'completed');

  it('at least two completed, on deliberate poor performers among them, each on the building’s last evaluation day', () => {
    expect(completed.length).toBeGreaterThanOrEqual(2);
    const poor = new Set(s.truth.poorPerformers.map((p) => `${p.installationCode} ${p.buildingNumber}`));
    expect(completed.filter((w) => poor.has(`${w.installationCode} ${w.buildingNumber}`)).length).toBeGreaterThanOrEqual(2);
    for (const w of completed) {
      const b = s.buildings.find((x) => x.installationCode === w.installationCode && x.number === w.buildingNumber)!;
      expect(w.plannedOn).toBe(b.lastEvaluatedOn);
      expect(w.form.lighting.rows.length + w.form.hvac.rows.length + w.form.plugLoads.rows.length + w.form.water.rows.length).toBeGreaterThan(4);
      expect(w.findings.some((x) => x.measure)).toBe(true);
    }
  });

  it('the boiler replacement at the retrofit building is implemented on the retrofit date', () => {
    const m = f.walkthroughs.flatMap((w) => w.findings).map((x) => x.measure).find((x) => x?.status === 'implemented');
    expect(m?.implementedOn).toBe(s.truth.retrofit.date);
    expect(m?.savings[0]?.commodity).toBe('natural_gas');
  });

  it('lighting savings follow the DOE Energy Saver arithmetic (W × hours ÷ 1000)', () => {
    const corridor = f.walkthroughs.flatMap((w) => w.findings).find((x) => x.title.startsWith('Corridor and stair lighting'))!.measure!;
    // Source: DOE Energy Saver, "wattage × hours per day × days per year ÷ 1000": 112 fixtures
    // from 59 W all year to 28 W for 70 % of the hours.
    expect(corridor.savings[0]!.quantity).toBeCloseTo(Math.round((112 * (59 * 8760 - 28 * 8760 * 0.7)) / 1000 / 10) * 10, 6);
    // Priced at BNP's stated demo electricity price, $0.104/kWh.
    expect(corridor.annualEnergyCostSavings).toBe(Math.round(corridor.savings[0]!.quantity * 0.104));
  });

  it('economics per 10 CFR 436 at the default 3 % rate: payback and SIR from the NIST Handbook 135 UPV', () => {
    const upv = (d: number, n: number) => ((1 + d) ** n - 1) / (d * (1 + d) ** n);
    for (const m of f.walkthroughs.flatMap((w) => w.findings).flatMap((x) => (x.measure ? [x.measure] : []))) {
      const e = m.economics as { simplePaybackYears: number; sir: number; discountRatePercent: number; effectiveFrom: string };
      const annual = m.annualEnergyCostSavings + m.annualWaterCostSavings + m.annualOmCostSavings;
      expect(e.discountRatePercent).toBe(3);
      expect(e.effectiveFrom).toMatch(/^\d{4}-\d{2}-\d{2}$/);
      expect(e.simplePaybackYears).toBeCloseTo((m.installedCost - m.incentives) / annual, 9);
      expect(e.sir).toBeCloseTo((annual * upv(0.03, m.lifeYears)) / (m.installedCost - m.incentives), 9);
    }
  });

  it('one planned walkthrough on an open flag, with a kit requested for its dates', () => {
    const planned = f.walkthroughs.filter((w) => w.status === 'planned');
    expect(planned).toHaveLength(1);
    const flag = f.flags.find((x) => x.id === planned[0]!.flagId)!;
    expect(flag.clearedAt).toBeNull();
    const l = f.loans.find((x) => x.walkthroughId === planned[0]!.id)!;
    expect(l.status).toBe('requested');
    expect(l.startDate <= planned[0]!.plannedOn && planned[0]!.plannedOn <= l.endDate).toBe(true);
  });

  it('is deterministic: the same seed gives the same field data, another seed other ids', () => {
    expect(JSON.stringify(generateDemoScenario().field)).toBe(JSON.stringify(f));
    expect(generateDemoScenario({ seed: 7 }).field.walkthroughs[0]!.id).not.toBe(f.walkthroughs[0]!.id);
  });
});
