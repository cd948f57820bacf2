import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { modifiedUniformPresentValue, singlePresentValue, uniformPresentValue } from '../../../src/lib/economics/present-value';
import { expectWithin } from '../field/expect-helpers';

/** Direct summation, written independently of the closed forms under test. */
function sumDiscounted(d: number, e: number, n: number): number {
  let total = 0;
  for (let t = 1; t <= n; t += 1) total += ((1 + e) / (1 + d)) ** t;
  return total;
}

describe('present-value factors', () => {
  it('matches the four-decimal compound-interest tables at 3 % and 10 %', () => {
    // Source: standard compound-interest tables [memory of the printed values]:
    // (P/A, 3 %, 10) = 8.5302; (P/F, 3 %, 10) = 0.7441; (P/A, 3 %, 25) = 17.4131; (P/A, 10 %, 10) = 6.1446; (P/F, 10 %, 10) = 0.3855
    expectWithin(uniformPresentValue(0.03, 10), 8.5302, 0.00005);
    expectWithin(singlePresentValue(0.03, 10), 0.7441, 0.00005);
    expectWithin(uniformPresentValue(0.03, 25), 17.4131, 0.00005);
    expectWithin(uniformPresentValue(0.1, 10), 6.1446, 0.00005);
    expectWithin(singlePresentValue(0.1, 10), 0.3855, 0.00005);
  });

  it('reproduces the UConn ITAC discount factors at 10 %', () => {
    // Source: UConn ITAC training notes, "Time Value of Money and Net Present Value", 10 % table:
    // years 1–5: 0.909, 0.826, 0.751, 0.683, 0.621; year 10: 0.386; year 20: 0.149
    const published: [number, number][] = [[1, 0.909], [2, 0.826], [3, 0.751], [4, 0.683], [5, 0.621], [10, 0.386], [20, 0.149]];
    for (const [year, factor] of published) expectWithin(singlePresentValue(0.1, year), factor, 0.0005);
  });

  it('gives UPV* 8.992 at d 3 %, e 1 %, 10 years (constructed) and equals the escalated sum', () => {
    // constructed: UPV* = 1.01/0.02 × [1 − (1.01/1.03)^10] = 8.9919; cross-checked by direct summation
    expectWithin(modifiedUniformPresentValue(0.03, 0.01, 10), 8.992, 0.001);
    expectWithin(modifiedUniformPresentValue(0.03, 0.01, 10), sumDiscounted(0.03, 0.01, 10), 1e-10);
  });

  it('handles the limits d = 0 and d = e (factor = n)', () => {
    expect(uniformPresentValue(0, 7)).toBe(7);
    expect(modifiedUniformPresentValue(0.04, 0.04, 12)).toBe(12);
    expectWithin(modifiedUniformPresentValue(0.04, 0.04 - 1e-12, 12), 12, 1e-6);
    expect(singlePresentValue(0.05, 0)).toBe(1);
  });

  it('UPV is the sum of the SPVs, and UPV* the escalated sum, for any rate and life', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.25, noNaN: true }), fc.double({ min: -0.05, max: 0.1, noNaN: true }), fc.integer({ min: 1, max: 60 }), (d, e, n) => {
        let spvSum = 0;
        for (let t = 1; t <= n; t += 1) spvSum += singlePresentValue(d, t);
        const upv = uniformPresentValue(d, n);
        const upvStar = modifiedUniformPresentValue(d, e, n);
        return Math.abs(upv - spvSum) <= 1e-9 * spvSum && Math.abs(upvStar - sumDiscounted(d, e, n)) <= 1e-9 * Math.max(1, upvStar);
      }),
    );
  });

  it('throws on a fractional number of years (a caller bug)', () => {
    expect(() => uniformPresentValue(0.03, 2.5)).toThrow(RangeError);
  });
});
