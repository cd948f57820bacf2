import { describe, expect, it } from 'vitest';
import { BaselineEngine, fitOptionsSchema, type BaselineResult } from '../../../src/lib/baseline/engine';
import { fitBaseline } from '../../../src/lib/baseline/fit-baseline';
import { packDailyMeans } from '../../../src/lib/baseline/daily-temperatures';
import { compareCandidates, defaultShapesFor } from '../../../src/lib/baseline/selection';
import { allNumbers, constantTemperatureSeries, DAY0, readJson, syntheticSeries } from './support';

const engine = new BaselineEngine();
const opts = (o: object = {}) => fitOptionsSchema.parse(o);
const fiveP = readJson<{ fiveParameter: { meanTempF: number[]; usePerDay: number[] } }>('baseline/constructed-vectors.json').fiveParameter;

function expectFailure(r: BaselineResult, reason: string): void {
  expect(r.ok).toBe(false);
  if (!r.ok) expect(r.reason).toBe(reason);
  expect(allNumbers(r).every(Number.isFinite)).toBe(true);
}

describe('degenerate input returns a typed reason, never NaN', () => {
  it('no bills → no-periods; one bill → too-few-periods', () => {
    const s = constantTemperatureSeries([40], [10]);
    expectFailure(engine.fit({ startDay: [], endDay: [], quantity: [] }, s.temps), 'no-periods');
    expectFailure(engine.fit(s.bills, s.temps), 'too-few-periods');
  });

  it('no weather for the bills → insufficient-temperature, with each period reported', () => {
    const s = constantTemperatureSeries([40, 50, 60], [10, 8, 6]);
    const far = packDailyMeans(DAY0 + 5000, new Float64Array(30).fill(50));
    const r = engine.fit(s.bills, far);
    expectFailure(r, 'insufficient-temperature');
    expect(r.periods.dropped.map((d) => d.reason)).toEqual(['insufficient-temperature', 'insufficient-temperature', 'insufficient-temperature']);
  });

  it('the same use per day in every period → zero-variance', () => {
    const s = constantTemperatureSeries([30, 40, 50, 60, 70], [7, 7, 7, 7, 7], [31, 28, 31, 30, 31]);
    expectFailure(engine.fit(s.bills, s.temps), 'zero-variance');
  });

  it('the same temperature in every period (all x equal): weather shapes say why, the mean model is kept', () => {
    const s = constantTemperatureSeries([50, 50, 50, 50, 50, 50], [10, 12, 9, 11, 10, 13]);
    const r = engine.fit(s.bills, s.temps);
    if (!r.ok) throw new Error(r.reason);
    expect(r.selected.shape).toBe('mean');
    expect(r.shapes.heating).toMatchObject({ ok: false, reason: 'no-degree-day-variation' });
    expect(r.shapes.linear).toMatchObject({ ok: false, reason: 'constant-temperature' });
    expect(allNumbers(r).every(Number.isFinite)).toBe(true);
  });

  it('malformed outside input → invalid-input from the zod boundary', () => {
    const r = fitBaseline({ bills: [{ start: '2024-02-30', end: '2024-03-01', quantity: 1 }], temperatures: [] });
    expectFailure(r, 'invalid-input');
  });
});

describe('shape restriction, statistics and acceptance', () => {
  it('without cooling shapes (e.g. gas) the 5P data fall back to a heating shape; cooling is not-requested', () => {
    const s = constantTemperatureSeries(fiveP.meanTempF, fiveP.usePerDay);
    const r = engine.fit(s.bills, s.temps, opts({ shapes: defaultShapesFor('natural_gas') }));
    if (!r.ok) throw new Error(r.reason);
    expect(['heating', 'linear', 'mean']).toContain(r.selected.shape);
    expect(r.shapes.cooling).toMatchObject({ ok: false, reason: 'not-requested' });
    expect(r.shapes['heating-cooling']).toMatchObject({ ok: false, reason: 'not-requested' });
  });

  it('recovers a noisy heating-cooling law within its noise and reports full statistics (synthetic, seeded)', () => {
    const s = syntheticSeries({ base: 100, heat: 4, tauH: 58, cool: 6, tauC: 70, noise: 0.02 }, 7);
    const r = engine.fit(s.bills, s.temps);
    if (!r.ok) throw new Error(r.reason);
    const m = r.selected;
    expect(m.shape).toBe('heating-cooling');
    expect(Math.abs(m.heatingBalanceF! - 58)).toBeLessThanOrEqual(2);
    expect(Math.abs(m.coolingBalanceF! - 70)).toBeLessThanOrEqual(2);
    expect(m.heatingSlope!).toBeGreaterThan(3.4);
    expect(m.heatingSlope!).toBeLessThan(4.6);
    expect(m.coolingSlope!).toBeGreaterThan(5.2);
    expect(m.coolingSlope!).toBeLessThan(6.8);
    expect(m.coefficients.map((c) => c.name)).toEqual(['intercept', 'heatingSlope', 'coolingSlope']);
    for (const c of m.coefficients) {
      expect(c.standardError).toBeGreaterThan(0);
      expect(c.pValue).toBeLessThan(0.001);
    }
    expect(m.quality.n).toBe(36);
    expect(m.quality.parameterCount).toBe(5);
    expect(m.dfResidual).toBe(33);
    expect(m.quality.cvrmse!).toBeLessThan(0.05);
    expect(r.acceptance.status).toBe('meets-criteria');
    // every shape's best candidate carries its own statistics
    for (const shape of ['mean', 'heating', 'cooling', 'linear'] as const) expect(r.shapes[shape]).toMatchObject({ ok: true });
    expect(r.periods.rows).toHaveLength(36);
    expect(allNumbers(r).every(Number.isFinite)).toBe(true);
  });

  it('acceptance: insufficient-data below 12 periods or 365 days; failing-criteria above the CV(RMSE) limit; thresholds editable', () => {
    const short = syntheticSeries({ base: 100, heat: 4, tauH: 58, cool: 0, tauC: 70, noise: 0.02 }, 3, 11);
    const r1 = engine.fit(short.bills, short.temps);
    if (!r1.ok) throw new Error(r1.reason);
    expect(r1.acceptance.status).toBe('insufficient-data');
    expect(r1.acceptance.periods).toMatchObject({ value: 11, threshold: 12, pass: false });

    const noisy = syntheticSeries({ base: 100, heat: 1, tauH: 58, cool: 0, tauC: 70, noise: 0.5 }, 5);
    const r2 = engine.fit(noisy.bills, noisy.temps);
    if (!r2.ok) throw new Error(r2.reason);
    expect(r2.selected.quality.cvrmse!).toBeGreaterThan(0.2);
    expect(r2.acceptance.status).toBe('failing-criteria');
    const r3 = engine.fit(noisy.bills, noisy.temps, opts({ acceptance: { maxCvrmse: 5 } }));
    if (!r3.ok) throw new Error(r3.reason);
    expect(r3.acceptance.status).toBe('meets-criteria');
  });

  it('selection ties go to fewer parameters, then to lower balance points (common practice)', () => {
    const score = (shape: 'heating' | 'cooling' | 'heating-cooling', adjR2: number, p: number, h: number | null, c: number | null) => ({ shape, adjR2, parameterCount: p, heatingBalanceF: h, coolingBalanceF: c });
    expect(compareCandidates(score('heating', 0.9, 3, 60, null), score('heating-cooling', 0.9, 5, 55, 70))).toBeLessThan(0);
    expect(compareCandidates(score('heating', 0.9, 3, 62, null), score('cooling', 0.9, 3, null, 61))).toBeGreaterThan(0);
    expect(compareCandidates(score('heating-cooling', 0.95, 5, 55, 70), score('heating', 0.9, 3, 60, null))).toBeLessThan(0);
  });
});
