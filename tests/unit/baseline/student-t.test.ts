import { describe, expect, it } from 'vitest';
import { logGamma, regularizedIncompleteBeta, studentTCdf, studentTQuantile, studentTTwoSidedP } from '../../../src/lib/baseline/student-t';
import { readCsvNumbers, readJson } from './support';

// Source: NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.2, critical values of Student's t
// (tests/fixtures/baseline/t-table.csv), printed to 3 decimals: our values must round to the table.
const table = readCsvNumbers('baseline/t-table.csv');
const alphas = ['0.10', '0.05', '0.025', '0.01', '0.005', '0.001'];

describe('Student t distribution', () => {
  it('quantiles match every entry of the NIST/SEMATECH t table to its 3 printed decimals', () => {
    let checked = 0;
    for (const row of table) {
      for (const a of alphas) {
        const q = studentTQuantile(1 - Number(a), row.df!);
        expect(Math.abs(q - row[a]!), `df=${row.df} alpha=${a}`).toBeLessThanOrEqual(0.0005 + 1e-12);
        checked++;
      }
    }
    expect(checked).toBe(33 * 6);
  });

  it('the CDF at a tabled critical value gives back the upper-tail probability (NIST/SEMATECH t table)', () => {
    for (const row of table) {
      for (const a of alphas) {
        const t = row[a]!;
        // a 3-decimal t moves the tail probability by at most density·0.0005 < 0.0002
        expect(Math.abs(1 - studentTCdf(t, row.df!) - Number(a)), `df=${row.df} alpha=${a}`).toBeLessThan(2e-4);
        expect(studentTCdf(-t, row.df!)).toBeCloseTo(1 - studentTCdf(t, row.df!), 14);
      }
    }
  });

  it('t(0.95, 11) = 1.7958848187 (constructed check, weather-normalization notes §6.2, mpmath 60 digits; not published)', () => {
    const v = readJson<{ fsu: { 't_0.95_11': number } }>('baseline/constructed-vectors.json');
    expect(Math.abs(studentTQuantile(0.95, 11) - v.fsu['t_0.95_11'])).toBeLessThan(1e-9);
  });

  it('has the closed forms of 1 and 2 degrees of freedom (Cauchy and the df = 2 formula; A&S 26.7)', () => {
    // common practice: df = 1 is the Cauchy distribution, F(t) = 1/2 + atan(t)/π
    for (const t of [-5, -1, 0.3, 2, 40]) expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 13);
    for (const p of [0.9, 0.975, 0.999]) expect(studentTQuantile(p, 1) / Math.tan(Math.PI * (p - 0.5))).toBeCloseTo(1, 11);
    // df = 2: F(t) = 1/2 + t / (2·sqrt(2 + t²))
    for (const t of [-3, -0.5, 1, 7]) expect(studentTCdf(t, 2)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(2 + t * t)), 13);
  });

  it('two-sided p-values keep precision in the far tail and are 1 at t = 0', () => {
    expect(studentTTwoSidedP(0, 10)).toBeCloseTo(1, 14);
    // df = 1: two-sided p = 1 − 2·atan(t)/π = 2·atan(1/t)/π, exact for the Cauchy distribution
    expect(studentTTwoSidedP(1e6, 1) / ((2 * Math.atan(1e-6)) / Math.PI)).toBeCloseTo(1, 9);
    expect(studentTTwoSidedP(Number.POSITIVE_INFINITY, 5)).toBe(0);
  });

  it('incomplete beta and log-gamma agree with closed forms (common practice)', () => {
    expect(regularizedIncompleteBeta(0.3, 1, 1)).toBeCloseTo(0.3, 14); // uniform
    expect(regularizedIncompleteBeta(0.25, 2, 1)).toBeCloseTo(0.0625, 14); // x^a for b = 1
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 13);
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 13);
  });
});
