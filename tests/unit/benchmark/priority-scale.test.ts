import fc from 'fast-check';
import { quantile } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { scaleCap, scaleTerm, scaleValue } from '../../../src/lib/benchmark/priority-scale';

const range = (a: number, b: number) => Float64Array.from({ length: b - a + 1 }, (_, i) => a + i);

describe('scaleCap', () => {
  it('is the type-7 percentile of the positive values: 1..20 at 0.95 → 19.05', () => {
    // Source: Hyndman & Fan (1996) definition 7 (R's default quantile): h = (n − 1)p = 18.05,
    // x[18] + 0.05 · (x[19] − x[18]) = 19 + 0.05 = 19.05 (0-based, hand computed)
    expect(scaleCap(range(1, 20), 0.95)).toBeCloseTo(19.05, 12);
  });

  it('ignores zeros, negatives and non-finite values', () => {
    const raw = Float64Array.of(0, 0, 0, -5, NaN, Infinity, 1, 2, 3, 4, 100);
    // positives 1, 2, 3, 4, 100; median (p = 0.5) = 3
    expect(scaleCap(raw, 0.5)).toBe(3);
    expect(scaleCap(Float64Array.of(0, -1, 0), 0.95)).toBe(0);
  });

  it('equals simple-statistics quantile (type 7) of the positive values (property)', () => {
    // Reference library: simple-statistics quantile, linear interpolation as R type 7
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -10, max: 1e6, noNaN: true }), { maxLength: 300 }),
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        (values, p) => {
          const positives = values.filter((v) => v > 0);
          const cap = scaleCap(Float64Array.from(values), p);
          if (positives.length === 0) expect(cap).toBe(0);
          else expect(cap).toBeCloseTo(quantile(positives, p), 6);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('rejects a percentile outside (0, 1]', () => {
    expect(() => scaleCap(range(1, 3), 0)).toThrow();
    expect(() => scaleCap(range(1, 3), 1.5)).toThrow();
  });
});

describe('scaleTerm', () => {
  it('maps 0 to 0, the cap and above to 1 (constructed)', () => {
    const out = new Float64Array(3);
    expect(scaleTerm(Float64Array.of(0, 5, 10), out, 1)).toBe(10);
    expect([...out]).toEqual([0, 0.5, 1]);
  });

  it('keeps one outlier from flattening everyone else (constructed)', () => {
    // 1..100 plus one 1e9: p95 of 101 positives is x[95] = 96, so 48 scales to 0.5;
    // dividing by the maximum would give 4.8e-8.
    const raw = Float64Array.of(...range(1, 100), 1e9);
    const out = new Float64Array(raw.length);
    expect(scaleTerm(raw, out, 0.95)).toBe(96);
    expect(out[47]).toBe(0.5);
    expect(out[100]).toBe(1);
  });

  it('stays within [0, 1] and keeps the order of raw values (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e6, max: 1e9, noNaN: true }), { maxLength: 200 }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (values, p) => {
          const raw = Float64Array.from(values);
          const out = new Float64Array(raw.length);
          scaleTerm(raw, out, p);
          for (let i = 0; i < raw.length; i++) {
            expect(out[i]).toBeGreaterThanOrEqual(0);
            expect(out[i]).toBeLessThanOrEqual(1);
            for (let j = 0; j < raw.length; j++) {
              if (raw[i]! <= raw[j]!) expect(out[i]).toBeLessThanOrEqual(out[j]!);
            }
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it('scaleValue returns 0 with no cap', () => {
    expect(scaleValue(5, 0)).toBe(0);
  });
});
