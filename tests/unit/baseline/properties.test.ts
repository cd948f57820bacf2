/**
 * Invariances of the least-squares engine (fast-check property tests). Common practice: they
 * follow from the algebra of weighted least squares with an intercept.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { BaselineEngine, fitOptionsSchema } from '../../../src/lib/baseline/engine';
import { PeriodTable, buildPeriodTable, type BillArrays } from '../../../src/lib/baseline/bill-periods';
import { fitShapeAt } from '../../../src/lib/baseline/model';
import { packDailyMeans } from '../../../src/lib/baseline/daily-temperatures';
import { allNumbers, syntheticSeries } from './support';

const engine = new BaselineEngine();
const options = fitOptionsSchema.parse({ includePeriods: false });

const law = fc.record({
  base: fc.double({ min: 5, max: 500, noNaN: true }),
  heat: fc.oneof(fc.constant(0), fc.double({ min: 0.2, max: 8, noNaN: true })),
  tauH: fc.integer({ min: 45, max: 65 }),
  cool: fc.oneof(fc.constant(0), fc.double({ min: 0.2, max: 10, noNaN: true })),
  tauC: fc.integer({ min: 62, max: 80 }),
  noise: fc.double({ min: 0.01, max: 0.15, noNaN: true }),
});
const seed = fc.integer({ min: 1, max: 1_000_000 });

function mapQuantity(b: BillArrays, f: (q: number, days: number) => number): BillArrays {
  const q = Float64Array.from({ length: b.quantity.length }, (_, i) => f(b.quantity[i]!, b.endDay[i]! - b.startDay[i]! + 1));
  return { startDay: b.startDay, endDay: b.endDay, quantity: q };
}

describe('engine invariances (property tests)', () => {
  it('scaling use by s > 0 scales intercept and slopes by s and keeps shape and balance points', () => {
    fc.assert(
      fc.property(law, seed, fc.double({ min: 0.001, max: 1000, noNaN: true }), (l, sd, s) => {
        const x = syntheticSeries(l, sd);
        const a = engine.fit(x.bills, x.temps, options);
        const b = engine.fit(mapQuantity(x.bills, (q) => q * s), x.temps, options);
        expect(b.ok).toBe(a.ok);
        if (!a.ok || !b.ok) return;
        expect(b.selected.shape).toBe(a.selected.shape);
        expect([b.selected.heatingBalanceF, b.selected.coolingBalanceF]).toEqual([a.selected.heatingBalanceF, a.selected.coolingBalanceF]);
        for (const k of ['intercept', 'heatingSlope', 'coolingSlope', 'slope'] as const) {
          const va = a.selected[k];
          const vb = b.selected[k];
          if (va === null) expect(vb).toBeNull();
          else expect(Math.abs(vb! - s * va)).toBeLessThanOrEqual(1e-8 * Math.abs(s) * (Math.abs(va) + a.selected.quality.meanUsePerDay));
        }
        expect(b.selected.quality.r2).toBeCloseTo(a.selected.quality.r2, 10);
      }),
      { numRuns: 60 },
    );
  });

  it('reordering the bills changes nothing', () => {
    fc.assert(
      fc.property(law, seed, fc.integer({ min: 0, max: 2 ** 31 - 1 }), (l, sd, shuffleSeed) => {
        const x = syntheticSeries(l, sd);
        const n = x.bills.startDay.length;
        const order = Array.from({ length: n }, (_, i) => i);
        let r = shuffleSeed;
        for (let i = n - 1; i > 0; i--) {
          r = (Math.imul(r, 1_103_515_245) + 12_345) >>> 0;
          const j = r % (i + 1);
          [order[i], order[j]] = [order[j]!, order[i]!];
        }
        const shuffled: BillArrays = {
          startDay: order.map((i) => x.bills.startDay[i]!),
          endDay: order.map((i) => x.bills.endDay[i]!),
          quantity: order.map((i) => x.bills.quantity[i]!),
        };
        const a = engine.fit(x.bills, x.temps, options);
        const b = engine.fit(shuffled, x.temps, options);
        expect(b).toEqual(a);
      }),
      { numRuns: 40 },
    );
  });

  it('adding a constant c to use per day moves only the intercept (at fixed balance points, every shape)', () => {
    fc.assert(
      fc.property(law, seed, fc.double({ min: -50, max: 50, noNaN: true }), fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: 60 }), (l, sd, c, k1, k2) => {
        const x = syntheticSeries(l, sd);
        const ta = new PeriodTable();
        const tb = new PeriodTable();
        buildPeriodTable(x.bills, x.temps, ta);
        buildPeriodTable(mapQuantity(x.bills, (q, days) => q + c * days), x.temps, tb);
        const [kh, kc] = k1 <= k2 ? [k1, k2] : [k2, k1];
        for (const shape of ['mean', 'heating', 'cooling', 'heating-cooling', 'linear'] as const) {
          const fa = fitShapeAt(ta, shape, kh, kc);
          const fb = fitShapeAt(tb, shape, kh, kc);
          expect(fb.ok).toBe(fa.ok);
          if (!fa.ok || !fb.ok) continue;
          const scale = Math.abs(fa.model.intercept) + Math.abs(c) + fa.model.quality.meanUsePerDay;
          expect(Math.abs(fb.model.intercept - (fa.model.intercept + c))).toBeLessThanOrEqual(1e-9 * scale);
          for (const key of ['heatingSlope', 'coolingSlope', 'slope'] as const) {
            if (fa.model[key] === null) expect(fb.model[key]).toBeNull();
            else expect(Math.abs(fb.model[key]! - fa.model[key]!)).toBeLessThanOrEqual(1e-9 * (Math.abs(fa.model[key]!) + scale));
          }
          expect(fb.model.quality.sseWeighted).toBeCloseTo(fa.model.quality.sseWeighted, 6);
        }
      }),
      { numRuns: 40 },
    );
  });

  it('adding c > 0 to use per day keeps the selection, unless it qualifies a candidate whose intercept was negative', () => {
    fc.assert(
      fc.property(law, seed, fc.double({ min: 0.5, max: 100, noNaN: true }), (l, sd, c) => {
        const x = syntheticSeries(l, sd);
        const a = engine.fit(x.bills, x.temps, options);
        const b = engine.fit(mapQuantity(x.bills, (q, days) => q + c * days), x.temps, options);
        if (!a.ok || !b.ok) return;
        const same = b.selected.shape === a.selected.shape && b.selected.heatingBalanceF === a.selected.heatingBalanceF && b.selected.coolingBalanceF === a.selected.coolingBalanceF;
        if (same) {
          expect(b.selected.intercept - a.selected.intercept).toBeCloseTo(c, 6);
          return;
        }
        // the new choice must be a candidate that failed qualification on the original data only by its intercept
        const t = new PeriodTable();
        buildPeriodTable(x.bills, x.temps, t);
        const kh = b.selected.heatingBalanceF === null ? -1 : b.selected.heatingBalanceF - 30;
        const kc = b.selected.coolingBalanceF === null ? -1 : b.selected.coolingBalanceF - 30;
        const before = fitShapeAt(t, b.selected.shape, kh, kc);
        expect(before.ok && before.model.intercept < 0).toBe(true);
      }),
      { numRuns: 40 },
    );
  });

  it('never returns NaN or Infinity, whatever the bills and temperatures', () => {
    const junkNumber = fc.oneof(fc.double(), fc.constant(Number.NaN), fc.constant(Number.POSITIVE_INFINITY), fc.integer({ min: -1e6, max: 1e6 }), fc.constant(0));
    fc.assert(
      fc.property(
        fc.array(fc.record({ start: fc.integer({ min: -50, max: 400 }), len: fc.integer({ min: -5, max: 80 }), q: junkNumber }), { maxLength: 40 }),
        fc.array(fc.oneof(fc.double({ min: -80, max: 130, noNaN: true }), fc.constant(Number.NaN), fc.constant(50)), { maxLength: 400 }),
        fc.constantFrom('all-shapes', 'selected'),
        (bills, temps, statistics) => {
          const b: BillArrays = { startDay: bills.map((x) => x.start), endDay: bills.map((x) => x.start + x.len), quantity: bills.map((x) => x.q) };
          const r = engine.fit(b, packDailyMeans(0, Float64Array.from(temps)), fitOptionsSchema.parse({ statistics }));
          const numbers = allNumbers(r);
          expect(numbers.every(Number.isFinite)).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });
});
