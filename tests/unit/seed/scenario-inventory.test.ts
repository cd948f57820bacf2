import { describe, expect, it } from 'vitest';
import { demoScenarioSchema, generateDemoScenario } from '../../../src/db/seed/scenario';
import { COMMODITIES, ROLES, UNITS, USE_TYPES } from '../../../src/lib/domain';
import { billsByMeter, dayNumber } from './scenario-helpers';

const scenario = generateDemoScenario();

describe('demo scenario: determinism', () => {
  it('gives byte-identical output for the same options', () => {
    const again = generateDemoScenario({ seed: 2026, today: '2026-11-30' });
    expect(JSON.stringify(again)).toBe(JSON.stringify(scenario));
  });

  it('gives different bills and weather for another seed, with the same story buildings', () => {
    const other = generateDemoScenario({ seed: 7 });
    expect(JSON.stringify(other.bills)).not.toBe(JSON.stringify(scenario.bills));
    expect(JSON.stringify(other.stations)).not.toBe(JSON.stringify(scenario.stations));
    expect(other.truth.poorPerformers.map((p) => p.buildingNumber)).toEqual(scenario.truth.poorPerformers.map((p) => p.buildingNumber));
  });

  it('ends weather at the given today and rejects a malformed date', () => {
    const early = generateDemoScenario({ today: '2025-03-15', years: 3, weatherYears: 10 });
    for (const s of early.stations) expect(s.days.at(-1)?.date).toBe('2025-03-15');
    expect(() => generateDemoScenario({ today: '2025-02-30' })).toThrow();
    expect(() => generateDemoScenario({ years: 2 })).toThrow();
  });
});

describe('demo scenario: inventory', () => {
  it('matches its published schema', () => {
    expect(demoScenarioSchema.safeParse(scenario).success).toBe(true);
  });

  it('has one invented region with five installations, each with its own station and a distinct climate', () => {
    expect(scenario.installations).toHaveLength(5);
    expect(new Set(scenario.installations.map((i) => i.code)).size).toBe(5);
    expect(new Set(scenario.installations.map((i) => i.stationCode)).size).toBe(5);
    expect(new Set(scenario.installations.map((i) => i.climate)).size).toBe(5);
    for (const i of scenario.installations) {
      expect(i.regionCode).toBe(scenario.region.code);
      expect(i.code).toMatch(/^[A-Z]{3}$/);
      expect(scenario.stations.some((s) => s.code === i.stationCode)).toBe(true);
      // Every zone is a valid IANA name for the platform's Intl (ECMA-402).
      expect(() => new Intl.DateTimeFormat('en-US', { timeZone: i.timeZone })).not.toThrow();
      expect(i.target.targetFy).toBeGreaterThan(i.target.baselineFy);
    }
  });

  it('has about 100 buildings of mixed use, dozens per installation, realistic years and areas', () => {
    expect(scenario.buildings.length).toBeGreaterThanOrEqual(90);
    expect(scenario.buildings.length).toBeLessThanOrEqual(110);
    for (const i of scenario.installations) {
      expect(scenario.buildings.filter((b) => b.installationCode === i.code).length).toBeGreaterThanOrEqual(12);
    }
    const types = new Set(scenario.buildings.map((b) => b.useType));
    for (const t of ['office', 'lodging', 'dining', 'warehouse', 'retail', 'clinic', 'training', 'fitness'] as const) expect(types.has(t)).toBe(true);
    expect(types.size).toBeGreaterThanOrEqual(10);
    for (const b of scenario.buildings) {
      expect(USE_TYPES).toContain(b.useType);
      expect(b.yearBuilt).toBeGreaterThanOrEqual(1940);
      expect(b.yearBuilt).toBeLessThanOrEqual(2020);
      expect(b.occupants).toBeGreaterThan(0);
    }
    expect(new Set(scenario.buildings.map((b) => b.number)).size).toBe(scenario.buildings.length);
    // Warehouses are larger than clinics on average (constructed expectation of the demo).
    const meanArea = (t: string): number => {
      const a = scenario.buildings.filter((b) => b.useType === t).map((b) => b.grossAreaFt2);
      return a.reduce((s, x) => s + x, 0) / a.length;
    };
    expect(meanArea('warehouse')).toBeGreaterThan(meanArea('clinic'));
  });

  it('has some buildings evaluated in past years and some never', () => {
    const today = dayNumber('2026-11-30');
    const evaluated = scenario.buildings.filter((b) => b.lastEvaluatedOn !== null);
    expect(evaluated.length).toBeGreaterThan(40);
    expect(scenario.buildings.length - evaluated.length).toBeGreaterThan(5);
    for (const b of evaluated) expect(dayNumber(b.lastEvaluatedOn as string)).toBeLessThan(today);
    // Both within and beyond the four-year federal evaluation cycle (EISA 2007 §432).
    expect(evaluated.some((b) => today - dayNumber(b.lastEvaluatedOn as string) > 4 * 365)).toBe(true);
    expect(evaluated.some((b) => today - dayNumber(b.lastEvaluatedOn as string) < 4 * 365)).toBe(true);
  });

  it('gives every building electricity and water, most a heating fuel, with region-unique meter codes', () => {
    expect(new Set(scenario.meters.map((m) => m.code)).size).toBe(scenario.meters.length);
    let heated = 0;
    for (const b of scenario.buildings) {
      const ms = scenario.meters.filter((m) => m.buildingNumber === b.number);
      expect(ms.filter((m) => m.commodity === 'electricity' && m.unit === 'kWh')).toHaveLength(1);
      expect(ms.filter((m) => m.commodity === 'water')).toHaveLength(1);
      if (ms.some((m) => m.commodity === 'natural_gas' || m.commodity === 'fuel_oil_2')) heated++;
    }
    expect(heated / scenario.buildings.length).toBeGreaterThan(0.6);
    for (const m of scenario.meters) {
      expect(COMMODITIES).toContain(m.commodity);
      expect(UNITS).toContain(m.unit);
      if (m.commodity === 'natural_gas') expect(['therm', 'ccf']).toContain(m.unit);
      if (m.commodity === 'fuel_oil_2') expect(m.unit).toBe('gal');
      if (m.commodity === 'water') expect(['kgal', 'gal', 'ccf']).toContain(m.unit);
      expect(scenario.truth.meters[m.code]?.unit).toBe(m.unit);
    }
    // Fuel oil only at the cold installation.
    const oil = scenario.meters.filter((m) => m.commodity === 'fuel_oil_2');
    expect(oil.length).toBeGreaterThan(0);
    expect(new Set(oil.map((m) => m.installationCode)).size).toBe(1);
  });

  it('has at least three years of monthly bills on every meter', () => {
    const byMeter = billsByMeter(scenario);
    for (const m of scenario.meters) {
      const bills = byMeter.get(m.code) ?? [];
      expect(bills.length).toBeGreaterThanOrEqual(36);
      const span = dayNumber(bills.at(-1)!.bill.periodEnd) - dayNumber(bills[0]!.bill.periodStart) + 1;
      expect(span).toBeGreaterThanOrEqual(3 * 365);
      for (const { bill } of bills) expect(bill.unit).toBe(m.unit);
    }
  });

  it('has at least ten years of daily weather per station ending today', () => {
    for (const s of scenario.stations) {
      const first = dayNumber(s.days[0]!.date);
      const last = dayNumber(s.days.at(-1)!.date);
      expect(last).toBe(dayNumber('2026-11-30'));
      expect(last - first + 1).toBeGreaterThanOrEqual(Math.ceil(10 * 365.25));
    }
  });

  it('has the demo accounts, one per role, all at the demo domain', () => {
    const emails = scenario.people.map((p) => p.email);
    expect(new Set(emails).size).toBe(emails.length);
    for (const p of scenario.people) {
      expect(p.email.endsWith('@demo.plumbline.test')).toBe(true);
      expect(ROLES).toContain(p.role);
      for (const c of p.installationCodes) expect(scenario.installations.some((i) => i.code === c)).toBe(true);
    }
    const person = (local: string) => scenario.people.find((p) => p.email === `${local}@demo.plumbline.test`);
    expect(person('admin')?.role).toBe('admin');
    expect(person('manager')?.role).toBe('regional_manager');
    expect(person('staff')?.role).toBe('installation_staff');
    expect(person('staff')?.installationCodes).toHaveLength(1);
    expect(person('analyst')?.role).toBe('analyst');
    expect(person('auditor')?.role).toBe('auditor');
    expect(person('auditor')?.installationCodes).toHaveLength(2);
    expect(person('custodian')?.role).toBe('kit_custodian');
    const staffed = new Set(scenario.people.filter((p) => p.role === 'installation_staff').flatMap((p) => p.installationCodes));
    expect(staffed.size).toBeGreaterThanOrEqual(3);
  });
});
