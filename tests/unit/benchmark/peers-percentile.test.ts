import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { peerPercentiles, type PeerValue } from '../../../src/lib/benchmark/peers-percentile';

const group = (values: (number | null)[], g = 'office'): PeerValue[] =>
  values.map((value, i) => ({ id: `${g}-${i}`, group: g, value }));

describe('peerPercentiles', () => {
  it("agrees with SciPy percentileofscore(kind='mean') on its documented example", () => {
    // Source: SciPy docs, scipy.stats.percentileofscore([1, 2, 3, 3, 4], 3):
    // kind='strict' 40, kind='weak' 80, kind='mean' 60
    const r = peerPercentiles(group([1, 2, 3, 3, 4])).get('office-2');
    expect(r).toEqual({ ok: true, percentile: 60, n: 5, below: 2, equal: 2 });
    if (r?.ok) {
      expect((100 * r.below) / r.n).toBe(40); // strict
      expect((100 * (r.below + r.equal)) / r.n).toBe(80); // weak
    }
  });

  it('gives ties the same percentile', () => {
    const m = peerPercentiles(group([1, 2, 3, 3, 4]));
    expect(m.get('office-2')).toEqual(m.get('office-3'));
  });

  it('needs at least two buildings with a value in the group', () => {
    const m = peerPercentiles([...group([50, null]), ...group([10, 20], 'lodging')]);
    expect(m.get('office-0')).toEqual({ ok: false, reason: 'too-few-peers', n: 1 });
    expect(m.get('office-1')).toEqual({ ok: false, reason: 'no-value', n: 1 });
    // Lodging is ranked on its own: 10 → (0 + 0.5)/2 = 25, 20 → (1 + 0.5)/2 = 75
    expect(m.get('lodging-0')).toMatchObject({ ok: true, percentile: 25 });
    expect(m.get('lodging-1')).toMatchObject({ ok: true, percentile: 75 });
  });

  it('equals a brute-force count for random groups (constructed, property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 20 }), { minLength: 2, maxLength: 40 }),
        (vals) => {
          const m = peerPercentiles(group(vals));
          vals.forEach((v, i) => {
            const below = vals.filter((x) => x < v).length;
            const equal = vals.filter((x) => x === v).length;
            const r = m.get(`office-${i}`);
            expect(r?.ok && r.percentile).toBeCloseTo(
              (100 * (below + equal / 2)) / vals.length,
              12,
            );
          });
        },
      ),
    );
  });
});
