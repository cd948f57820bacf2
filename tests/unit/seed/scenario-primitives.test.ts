import { describe, expect, it } from 'vitest';
import { civilToDay, dayToIso, federalFiscalYear, firstOfMonthOffset, isIsoDate, isoToDay } from '../../../src/db/seed/scenario/dates';
import { Rng, mulberry32 } from '../../../src/db/seed/scenario/prng';

describe('scenario dates', () => {
  it('agree with the platform Date in UTC over 1940–2040 (ECMAScript Date, proleptic Gregorian)', () => {
    const mismatches: number[] = [];
    for (let n = civilToDay(1940, 1, 1); n <= civilToDay(2040, 12, 31); n += 7) {
      const iso = new Date(n * 86_400_000).toISOString().slice(0, 10);
      if (dayToIso(n) !== iso || isoToDay(iso) !== n) mismatches.push(n);
    }
    expect(mismatches).toEqual([]);
    expect(civilToDay(1970, 1, 1)).toBe(0);
  });

  it('rejects impossible dates', () => {
    expect(isIsoDate('2024-02-29')).toBe(true); // 2024 is a leap year (Gregorian rule)
    expect(isIsoDate('2023-02-29')).toBe(false);
    expect(isIsoDate('2026-13-01')).toBe(false);
    expect(() => isoToDay('2026-04-31')).toThrow();
  });

  it('gives the US federal fiscal year: FY2024 runs 1 Oct 2023 – 30 Sep 2024 (31 U.S.C. 1102)', () => {
    expect(federalFiscalYear(isoToDay('2023-09-30'))).toBe(2023);
    expect(federalFiscalYear(isoToDay('2023-10-01'))).toBe(2024);
    expect(federalFiscalYear(isoToDay('2024-09-30'))).toBe(2024);
  });

  it('steps whole months across year ends', () => {
    expect(dayToIso(firstOfMonthOffset(isoToDay('2026-11-30'), -18))).toBe('2025-05-01');
    expect(dayToIso(firstOfMonthOffset(isoToDay('2026-01-15'), 1))).toBe('2026-02-01');
    expect(dayToIso(firstOfMonthOffset(isoToDay('2026-01-15'), -1))).toBe('2025-12-01');
  });
});

describe('scenario random streams', () => {
  it('repeat for the same seed and label and differ for another label', () => {
    const a = new Rng(5, 'x');
    const b = new Rng(5, 'x');
    const c = new Rng(5, 'y');
    const sa = Array.from({ length: 20 }, () => a.uniform());
    expect(Array.from({ length: 20 }, () => b.uniform())).toEqual(sa);
    expect(Array.from({ length: 20 }, () => c.uniform())).not.toEqual(sa);
  });

  it('mulberry32 stays in [0, 1) with mean 1/2 and variance 1/12 (uniform distribution moments)', () => {
    const next = mulberry32(12345);
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    let outside = 0;
    for (let i = 0; i < n; i++) {
      const u = next();
      if (u < 0 || u >= 1) outside++;
      s += u;
      s2 += u * u;
    }
    expect(outside).toBe(0);
    const mean = s / n;
    // Standard error of the mean is sqrt(1/12/n) ≈ 0.00065; allow 5 of them.
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.0033);
    expect(Math.abs(s2 / n - mean * mean - 1 / 12)).toBeLessThan(0.002);
  });

  it('Box-Muller draws have mean 0, sd 1 and the normal tail share beyond 2 sd (4.55 %, standard normal table)', () => {
    const rng = new Rng(99, 'normal');
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    let tail = 0;
    for (let i = 0; i < n; i++) {
      const z = rng.normal();
      s += z;
      s2 += z * z;
      if (Math.abs(z) > 2) tail++;
    }
    expect(Math.abs(s / n)).toBeLessThan(0.012);
    expect(Math.abs(Math.sqrt(s2 / n) - 1)).toBeLessThan(0.01);
    expect(Math.abs(tail / n - 0.0455)).toBeLessThan(0.003);
  });

  it('truncated normal draws never pass the limit', () => {
    const rng = new Rng(1, 't');
    let worst = 0;
    for (let i = 0; i < 50_000; i++) worst = Math.max(worst, Math.abs(rng.truncatedNormal(1.5)));
    expect(worst).toBeLessThanOrEqual(1.5);
    expect(worst).toBeGreaterThan(1.4);
  });
});
