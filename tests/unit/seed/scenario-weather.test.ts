import { describe, expect, it } from 'vitest';
import { generateDemoScenario } from '../../../src/db/seed/scenario';
import { coolingDegreeDays, heatingDegreeDays } from '../../../src/db/seed/scenario/degree-days';
import { cdd, dayNumber, hdd } from './scenario-helpers';

const scenario = generateDemoScenario();

describe('degree days against published values', () => {
  // The generator's helpers and the tests' own helpers must both agree with the published cases.
  const cases: [string, (t: number, b: number) => number, (t: number, b: number) => number][] = [
    ['generator', heatingDegreeDays, coolingDegreeDays],
    ['test helper', hdd, cdd],
  ];
  for (const [name, h, c] of cases) {
    it(`${name}: US base 65 °F`, () => {
      // Source: NOAA/NWS definition quoted in the Lawrence Journal-World, 3 Aug 2003: 75/65 °F → 5 CDD65.
      expect(c((75 + 65) / 2, 65)).toBe(5);
      // Source: City of Burlington NC FAQ: 90/70 °F → 15 CDD65.
      expect(c((90 + 70) / 2, 65)).toBe(15);
      // Source: WGN-TV weather column, 29 Oct 2017: a 40 °F day → 25 HDD65.
      expect(h(40, 65)).toBe(25);
      expect(h(70, 65)).toBe(0);
    });
    it(`${name}: base 18 °C`, () => {
      // Source: Statistics Netherlands (CBS) 2015: 10 °C → 8, −4 °C → 22, 20 °C → 0 at base 18 °C.
      expect(h(10, 18)).toBe(8);
      expect(h(-4, 18)).toBe(22);
      expect(h(20, 18)).toBe(0);
    });
  }
});

/** Mean daily mean temperature per calendar month over complete data. */
function monthlyMeans(station: (typeof scenario.stations)[number]): number[] {
  const sum = new Array<number>(12).fill(0);
  const n = new Array<number>(12).fill(0);
  for (const d of station.days) {
    if (d.tmaxF === null || d.tminF === null) continue;
    const m = Number(d.date.slice(5, 7)) - 1;
    sum[m]! += (d.tmaxF + d.tminF) / 2;
    n[m]! += 1;
  }
  return sum.map((s, i) => s / n[i]!);
}

/** Mean annual HDD65, CDD50 and CDD65 over the complete calendar years. */
function annualDegreeDays(station: (typeof scenario.stations)[number]): { hdd65: number; cdd50: number; cdd65: number } {
  let h = 0;
  let c50 = 0;
  let c65 = 0;
  const years = new Set<string>();
  for (const d of station.days) {
    if (d.tmaxF === null || d.tminF === null || d.date >= '2026-01-01') continue;
    years.add(d.date.slice(0, 4));
    const t = (d.tmaxF + d.tminF) / 2;
    h += hdd(t, 65);
    c50 += cdd(t, 50);
    c65 += cdd(t, 65);
  }
  return { hdd65: h / years.size, cdd50: c50 / years.size, cdd65: c65 / years.size };
}

/**
 * Thermal climate zone number from annual degree days, ASHRAE Standard 169 thermal criteria
 * in IP units [memory]: 1 CDD50 > 9000; 2 6300 < CDD50 ≤ 9000; 3 4500 < CDD50 ≤ 6300 and
 * HDD65 ≤ 5400; 4 CDD50 ≤ 4500 and HDD65 ≤ 5400; 5 5400 < HDD65 ≤ 7200; 6 7200 < HDD65 ≤ 9000;
 * 7 9000 < HDD65 ≤ 12600; 8 HDD65 > 12600.
 */
function thermalZone({ hdd65, cdd50 }: { hdd65: number; cdd50: number }): number {
  if (cdd50 > 9000) return 1;
  if (cdd50 > 6300) return 2;
  if (cdd50 > 4500 && hdd65 <= 5400) return 3;
  if (hdd65 <= 5400) return 4;
  if (hdd65 <= 7200) return 5;
  if (hdd65 <= 9000) return 6;
  if (hdd65 <= 12600) return 7;
  return 8;
}

describe('demo weather', () => {
  it('has whole-°F values with Tmin ≤ Tmax', () => {
    let bad = 0;
    let checked = 0;
    for (const s of scenario.stations) {
      for (const d of s.days) {
        if (d.tmaxF !== null && !Number.isInteger(d.tmaxF)) bad++;
        if (d.tminF !== null && !Number.isInteger(d.tminF)) bad++;
        if (d.tmaxF !== null && d.tminF !== null && d.tminF > d.tmaxF) bad++;
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(5 * 3650);
    expect(bad).toBe(0);
  });

  it('peaks in summer and bottoms in winter (Northern Hemisphere, common practice)', () => {
    for (const s of scenario.stations) {
      const m = monthlyMeans(s);
      const coldest = m.indexOf(Math.min(...m));
      const warmest = m.indexOf(Math.max(...m));
      expect([11, 0, 1]).toContain(coldest);
      expect([5, 6, 7]).toContain(warmest);
    }
  });

  it('falls in the thermal climate zone each installation states', () => {
    for (const i of scenario.installations) {
      const station = scenario.stations.find((s) => s.code === i.stationCode)!;
      expect(station.climate).toBe(i.climate);
      const stated = Number(i.climate.slice(0, 1));
      expect(thermalZone(annualDegreeDays(station)), `${i.code} ${i.climate}`).toBe(stated);
    }
  });

  it('spans clearly different climates', () => {
    const dd = new Map(scenario.installations.map((i) => [i.climate, annualDegreeDays(scenario.stations.find((s) => s.code === i.stationCode)!)]));
    const cold = dd.get('6A cold')!;
    const humid = dd.get('2A hot-humid')!;
    const marine = dd.get('4C marine')!;
    const mixed = dd.get('4A mixed-humid')!;
    // Marine: mild, hardly any cooling; mixed: both seasons (constructed expectations of the demo).
    expect(marine.cdd65).toBeLessThan(300);
    expect(mixed.hdd65).toBeGreaterThan(3000);
    expect(mixed.cdd65).toBeGreaterThan(800);
    for (const [climate, other] of dd) {
      if (climate !== '6A cold') expect(cold.hdd65).toBeGreaterThan(other.hdd65);
      if (climate !== '2A hot-humid') expect(humid.cdd65).toBeGreaterThan(other.cdd65);
    }
  });

  it('has a wider diurnal range at the hot-dry site than at the marine one (common practice)', () => {
    const range = (code: string): number => {
      const s = scenario.stations.find((x) => x.code === code)!;
      const r = s.days.filter((d) => d.tmaxF !== null && d.tminF !== null).map((d) => d.tmaxF! - d.tminF!);
      return r.reduce((a, b) => a + b, 0) / r.length;
    };
    const dry = scenario.installations.find((i) => i.climate === '3B hot-dry')!.stationCode;
    const marine = scenario.installations.find((i) => i.climate === '4C marine')!.stationCode;
    expect(range(dry)).toBeGreaterThan(range(marine) + 5);
  });

  it('has a few single missing days and one multi-day gap per station', () => {
    for (const s of scenario.stations) {
      const nulls = s.days.filter((d) => d.tmaxF === null || d.tminF === null);
      expect(nulls.length).toBeGreaterThanOrEqual(3);
      expect(nulls.length).toBeLessThanOrEqual(10);
      const gaps: number[] = [];
      let outOfOrder = 0;
      for (let i = 1; i < s.days.length; i++) {
        const step = dayNumber(s.days[i]!.date) - dayNumber(s.days[i - 1]!.date);
        if (step < 1) outOfOrder++;
        if (step > 1) gaps.push(step - 1);
      }
      expect(outOfOrder).toBe(0);
      expect(gaps).toHaveLength(1);
      expect(gaps[0]).toBeGreaterThanOrEqual(3);
    }
  });
});
