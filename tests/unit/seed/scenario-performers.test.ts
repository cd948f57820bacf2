import { describe, expect, it } from 'vitest';
import { generateDemoScenario, type DemoScenario } from '../../../src/db/seed/scenario';
import { billsByMeter, dayNumber } from './scenario-helpers';

const scenario = generateDemoScenario();
const TODAY = dayNumber('2026-11-30');

// Median site EUI, kBtu/ft²·yr. Source: U.S. EIA, 2018 CBECS, Table C12 (Dec 2022), median column:
// Office 53.5; Lodging 86.1; Food service 232.9; Warehouse and storage 14.0; Retail (other than
// mall) 40.8; Outpatient health care 60.6; Education 48.6; Recreation 53.2; Laboratory 86.4;
// Vehicle storage or maintenance 29.4; Religious worship 32.9.
const CBECS_MEDIAN: Record<string, number> = {
  office: 53.5,
  lodging: 86.1,
  dining: 232.9,
  warehouse: 14.0,
  retail: 40.8,
  clinic: 60.6,
  training: 48.6,
  fitness: 53.2,
  laboratory: 86.4,
  vehicle_maintenance: 29.4,
  religious: 32.9,
};

/** kBtu per unit. Source: U.S. EIA, Units and calculators explained: British thermal units. */
function kbtuPerUnit(meter: DemoScenario['meters'][number]): number {
  if (meter.commodity === 'electricity' && meter.unit === 'kWh') return 3.412; // EIA: 3,412 Btu/kWh
  if (meter.commodity === 'natural_gas' && meter.unit === 'therm') return 100; // definition, EIA
  if (meter.commodity === 'fuel_oil_2' && meter.unit === 'gal') return 138.5; // EIA: heating oil 138,500 Btu/gal
  // Gas billed by volume: the utility's stated heat content, else EIA's 1,036 Btu/cf national average.
  if (meter.commodity === 'natural_gas' && meter.unit === 'ccf') return meter.heatContentKbtuPerUnit ?? 103.6;
  throw new Error(`no conversion for ${meter.commodity} ${meter.unit}`);
}

const byMeter = billsByMeter(scenario);

/** Use over [from, to] spreading each bill evenly over its covered days (calendarization, common practice). */
function useInWindow(meterCode: string, from: number, to: number): number {
  let total = 0;
  for (const b of byMeter.get(meterCode) ?? []) {
    const overlap = Math.min(b.to, to) - Math.max(b.from, from) + 1;
    if (overlap > 0) total += (b.bill.quantity * overlap) / b.days;
  }
  return total;
}

/** Site EUI of a building over the 365 days ending 30 days before today (all meters have bills there). */
function siteEui(b: DemoScenario['buildings'][number], endOffset = 30): number {
  const to = TODAY - endOffset;
  const from = to - 364;
  let kbtu = 0;
  for (const m of scenario.meters.filter((x) => x.buildingNumber === b.number && x.commodity !== 'water')) {
    kbtu += useInWindow(m.code, from, to) * kbtuPerUnit(m);
  }
  return kbtu / b.grossAreaFt2;
}

const ratio = new Map(scenario.buildings.map((b) => [b.number, siteEui(b) / CBECS_MEDIAN[b.useType]!]));
const poorNumbers = new Set(scenario.truth.poorPerformers.map((p) => p.buildingNumber));

describe('demo poor performers', () => {
  it('names three to five deliberate poor performers with a reason each', () => {
    expect(scenario.truth.poorPerformers.length).toBeGreaterThanOrEqual(3);
    expect(scenario.truth.poorPerformers.length).toBeLessThanOrEqual(5);
    for (const p of scenario.truth.poorPerformers) {
      expect(p.reason.length).toBeGreaterThan(30);
      expect(scenario.buildings.some((b) => b.number === p.buildingNumber && b.installationCode === p.installationCode)).toBe(true);
      expect(scenario.meters.some((m) => m.code === p.meterCode && m.buildingNumber === p.buildingNumber)).toBe(true);
    }
  });

  it('each has a site EUI over 1.5x the CBECS 2018 median of its type', () => {
    for (const p of scenario.truth.poorPerformers) expect(ratio.get(p.buildingNumber), p.buildingNumber).toBeGreaterThan(1.5);
  });

  it('most other buildings sit within 0.6–1.6x their CBECS median, and the poor performers top the list', () => {
    const others = scenario.buildings.filter((b) => !poorNumbers.has(b.number));
    const within = others.filter((b) => ratio.get(b.number)! >= 0.6 && ratio.get(b.number)! <= 1.6);
    expect(within.length / others.length).toBeGreaterThanOrEqual(0.9);
    const ranked = [...ratio].sort((a, b) => b[1] - a[1]).map(([n]) => n);
    expect(new Set(ranked.slice(0, poorNumbers.size))).toEqual(poorNumbers);
  });

  it('shows the right reason for each: base load, heating, water, a year-over-year jump, no evaluation', () => {
    const of = (kind: string) => scenario.truth.poorPerformers.find((p) => p.kind === kind)!;
    const building = (n: string) => scenario.buildings.find((b) => b.number === n)!;
    const peers = (n: string) => scenario.buildings.filter((b) => b.useType === building(n).useType && !poorNumbers.has(b.number));
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    const to = TODAY - 30;
    const from = to - 364;
    const elecOf = (n: string) => scenario.meters.find((m) => m.buildingNumber === n && m.commodity === 'electricity')!;
    const waterGal = (n: string) => {
      const m = scenario.meters.find((x) => x.buildingNumber === n && x.commodity === 'water')!;
      // 1 kgal = 1000 gal; 1 ccf = 748.052 gal (definitions).
      const gal = m.unit === 'kgal' ? 1000 : m.unit === 'ccf' ? 748.052 : 1;
      return useInWindow(m.code, from, to) * gal;
    };

    // Base load: the lowest monthly use per day per ft² (the month with least weather load).
    const baseLoad = (n: string) => {
      const bills = byMeter.get(elecOf(n).code)!.filter((b) => b.bill.quantity > 0);
      return Math.min(...bills.map((b) => b.bill.quantity / b.days)) / building(n).grossAreaFt2;
    };
    const office = of('base-load');
    expect(baseLoad(office.buildingNumber)).toBeGreaterThan(2 * median(peers(office.buildingNumber).map((b) => baseLoad(b.number))));

    // Heating: winter (Dec–Feb) fuel kBtu/ft² against the same type at the same installation.
    const heating = of('heating');
    const winterKbtu = (n: string) => {
      const m = scenario.meters.find((x) => x.buildingNumber === n && (x.commodity === 'natural_gas' || x.commodity === 'fuel_oil_2'));
      if (!m) return 0;
      return (useInWindow(m.code, dayNumber('2025-12-01'), dayNumber('2026-02-28')) * kbtuPerUnit(m)) / building(n).grossAreaFt2;
    };
    const sameSite = peers(heating.buildingNumber).filter((b) => b.installationCode === heating.installationCode);
    expect(sameSite.length).toBeGreaterThan(0);
    expect(winterKbtu(heating.buildingNumber)).toBeGreaterThan(1.8 * Math.max(...sameSite.map((b) => winterKbtu(b.number))));

    // Water: water use intensity against the other dining halls.
    const leak = of('water-leak');
    const wui = (n: string) => waterGal(n) / building(n).grossAreaFt2;
    expect(wui(leak.buildingNumber)).toBeGreaterThan(2.5 * median(peers(leak.buildingNumber).map((b) => wui(b.number))));

    // Year over year: electricity of the last 12 months against the 12 before.
    const yoy = of('year-over-year');
    const e = elecOf(yoy.buildingNumber).code;
    expect(useInWindow(e, from, to) / useInWindow(e, from - 365, from - 1)).toBeGreaterThan(1.5);
    expect(yoy.changedOn! > '2025-06-01').toBe(true);

    // Never evaluated.
    expect(building(of('never-evaluated').buildingNumber).lastEvaluatedOn).toBeNull();
  });
});
