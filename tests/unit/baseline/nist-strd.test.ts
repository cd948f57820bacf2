import { describe, expect, it } from 'vitest';
import { weightedLeastSquares } from '../../../src/lib/baseline/least-squares';
import { leastSquaresQr } from '../../../src/lib/baseline/householder-qr';
import { readCsvNumbers, readJson, relativeError } from './support';

interface Certified {
  parameters: { name: string; estimate: number; standard_deviation: number }[];
  residual_standard_deviation: number;
  r_squared: number;
  anova: { residual: { sum_of_squares: number } };
}

describe('closed-form least-squares core', () => {
  // Source: NIST StRD, Linear Regression, Norris (tests/fixtures/nist-strd/norris.*), certified values
  const rows = readCsvNumbers('nist-strd/norris.csv');
  const cert = readJson<Certified>('nist-strd/norris.json');
  const fit = weightedLeastSquares([rows.map((r) => r.x!)], rows.map((r) => r.y!));
  if (!fit.ok) throw new Error(fit.reason);
  const digits9 = 1e-9;

  it('reproduces B0 and B1 to at least 9 significant digits (NIST StRD Norris)', () => {
    expect(relativeError(fit.intercept, cert.parameters[0]!.estimate)).toBeLessThan(digits9);
    expect(relativeError(fit.slopes[0]!, cert.parameters[1]!.estimate)).toBeLessThan(digits9);
  });

  it('reproduces the residual SD and R² to at least 9 significant digits (NIST StRD Norris)', () => {
    const residualSd = Math.sqrt(fit.ssResidual / fit.dfResidual);
    expect(relativeError(residualSd, cert.residual_standard_deviation)).toBeLessThan(digits9);
    expect(relativeError(1 - fit.ssResidual / fit.ssTotal, cert.r_squared)).toBeLessThan(digits9);
    expect(relativeError(fit.ssResidual, cert.anova.residual.sum_of_squares)).toBeLessThan(digits9);
  });

  it('reproduces the standard deviations of B0 and B1 (NIST StRD Norris)', () => {
    expect(relativeError(Math.sqrt(fit.covariance[0]![0]!), cert.parameters[0]!.standard_deviation)).toBeLessThan(digits9);
    expect(relativeError(Math.sqrt(fit.covariance[1]![1]!), cert.parameters[1]!.standard_deviation)).toBeLessThan(digits9);
  });

  it('returns a typed reason, not NaN, when all x are equal', () => {
    expect(weightedLeastSquares([[3, 3, 3, 3]], [1, 2, 3, 4])).toEqual({ ok: false, reason: 'constant-x' });
    expect(weightedLeastSquares([[1, 2]], [1, 2])).toEqual({ ok: false, reason: 'too-few-points' });
    expect(weightedLeastSquares([[1, 2, 3], [2, 5, 6]], [1, 2, 4])).toEqual({ ok: false, reason: 'too-few-points' });
    expect(weightedLeastSquares([[1, 2, 3, 4], [2, 4, 6, 8]], [1, 2, 4, 5])).toEqual({ ok: false, reason: 'collinear' });
  });
});

describe('Householder QR solver', () => {
  // Source: NIST StRD, Linear Regression, Longley (tests/fixtures/nist-strd/longley.*), certified values
  const rows = readCsvNumbers('nist-strd/longley.csv');
  const cert = readJson<Certified>('nist-strd/longley.json');
  const columns = ['x1', 'x2', 'x3', 'x4', 'x5', 'x6'].map((c) => rows.map((r) => r[c]!));
  const fit = leastSquaresQr(columns, rows.map((r) => r.y!));
  if (!fit.ok) throw new Error(fit.reason);
  const digits7 = 1e-7;

  it('reproduces all 7 certified coefficients of the ill-conditioned Longley data to ≥ 7 digits', () => {
    expect(fit.coefficients).toHaveLength(7);
    cert.parameters.forEach((p, j) => expect(relativeError(fit.coefficients[j]!, p.estimate), p.name).toBeLessThan(digits7));
  });

  it('reproduces the certified standard deviations, residual SD and R² of Longley to ≥ 7 digits', () => {
    cert.parameters.forEach((p, j) => expect(relativeError(fit.standardErrors[j]!, p.standard_deviation), p.name).toBeLessThan(digits7));
    expect(relativeError(fit.residualStandardDeviation, cert.residual_standard_deviation)).toBeLessThan(digits7);
    expect(relativeError(fit.rSquared, cert.r_squared)).toBeLessThan(digits7);
  });

  it('agrees with the certified Norris values as well (NIST StRD Norris)', () => {
    const n = readCsvNumbers('nist-strd/norris.csv');
    const c = readJson<Certified>('nist-strd/norris.json');
    const q = leastSquaresQr([n.map((r) => r.x!)], n.map((r) => r.y!));
    if (!q.ok) throw new Error(q.reason);
    expect(relativeError(q.coefficients[0]!, c.parameters[0]!.estimate)).toBeLessThan(1e-9);
    expect(relativeError(q.coefficients[1]!, c.parameters[1]!.estimate)).toBeLessThan(1e-9);
  });

  it('reports a rank-deficient design instead of returning NaN', () => {
    const x = [1, 2, 3, 4, 5];
    expect(leastSquaresQr([x, x.map((v) => 2 * v)], [1, 3, 2, 5, 4])).toEqual({ ok: false, reason: 'rank-deficient' });
  });
});
