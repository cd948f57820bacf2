import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { USE_TYPES } from '../../../src/lib/domain';
import { scorePriority, type PriorityCandidate } from '../../../src/lib/benchmark/priority';
import { rankPriority } from '../../../src/lib/benchmark/priority-rank';
import {
  DEFAULT_PRIORITY_WEIGHTS,
  normalizeWeights,
  PRIORITY_TERMS,
  priorityWeightsSchema,
  type PriorityWeights,
} from '../../../src/lib/benchmark/priority-weights';

const asOf = '2025-06-30';
const only = (term: keyof PriorityWeights): PriorityWeights => ({
  excessEnergy: 0,
  excessCost: 0,
  yoyIncrease: 0,
  anomalies: 0,
  evaluationAge: 0,
  manualFlag: 0,
  [term]: 1,
});

type Row = [
  string,
  PriorityCandidate['useType'],
  number,
  number | null,
  number | null,
  [number, number] | null,
  number | null,
  string | null,
  boolean,
];
// Constructed fixture (invented buildings; they test behaviour, not a published value).
// id/number, use, ft², EUI_norm, $/kBtu, yoy [current, previous], anomalies of 12, last evaluation, flag
// Excess over CBECS 2018 C12 medians (office 53.5, lodging 86.1, warehouse 14.0, food service 232.9,
// education 48.6, outpatient 60.6), hand computed:
const rows: Row[] = [
  ['101', 'office', 10_000, 80.25, 0.03, [110, 100], 2, '2021-03-15', false], // 26.75 × 10,000 = 267,500
  ['102', 'office', 50_000, 60, 0.02, [100, 100], 0, '2024-01-10', false], // 6.5 × 50,000 = 325,000
  ['103', 'lodging', 40_000, 120, 0.025, [95, 100], 0, null, false], // 33.9 × 40,000 = 1,356,000
  ['104', 'warehouse', 100_000, 10, 0.03, null, null, '2025-06-30', false], // below median: 0
  ['105', 'dining', 8_000, 300, 0.04, [120, 100], 4, '2020-10-01', true], // 67.1 × 8,000 = 536,800
  ['106', 'training', 30_000, 45, 0.03, [100, 100], 0, '2023-06-30', false], // below median: 0
  ['107', 'office', 20_000, null, null, null, null, '2022-06-30', false], // no baseline: 0
  ['108', 'clinic', 15_000, 90, 0.035, [102, 100], 1, '2019-01-01', false], // 29.4 × 15,000 = 441,000
];
const fixture: PriorityCandidate[] = rows.map(
  ([n, useType, areaFt2, eui, price, yoy, anom, last, flag]) => ({
    buildingId: `b${n}`,
    buildingNumber: n,
    useType,
    areaFt2,
    euiNormalized: eui,
    pricePerKbtu: price,
    yoy: yoy && { current: yoy[0], previous: yoy[1] },
    anomalies:
      anom === null
        ? null
        : { recentPeriods: 12, beyond2Se: anom, largestSe: anom ? 2.5 + anom : null },
    lastEvaluated: last,
    manualFlag: flag,
    flagReason: flag ? 'Kitchen hoods run all night' : null,
  }),
);

const order = (cands: PriorityCandidate[], w: PriorityWeights) =>
  rankPriority(cands, w, { asOf }).map((r) => r.candidate.buildingNumber);

describe('audit priority: raw terms', () => {
  it('excess energy = max(0, EUI − median) × area, cost = excess × blended price', () => {
    // Source: methods §5; CBECS 2018 Table C12 office median 53.5: (80.25 − 53.5) × 10,000 = 267,500
    const r = rankPriority(fixture, DEFAULT_PRIORITY_WEIGHTS, { asOf });
    const b101 = r.find((x) => x.candidate.buildingNumber === '101')!;
    expect(b101.excessKbtu).toBeCloseTo(267_500, 6);
    expect(b101.excessCost).toBeCloseTo(8_025, 6); // 267,500 × $0.03
    expect(b101.peerMedian).toBe(53.5);
    const b104 = r.find((x) => x.candidate.buildingNumber === '104')!;
    expect(b104.excessKbtu).toBe(0);
  });

  it('evaluation age scales 0 when just evaluated, 1 at four years or never (EISA 2007 §432)', () => {
    // Source: 42 U.S.C. 8253(f)(3) (EISA 2007 §432): each facility evaluated at least every 4 years
    const s = scorePriority(fixture, DEFAULT_PRIORITY_WEIGHTS, { asOf });
    const t = PRIORITY_TERMS.indexOf('evaluationAge');
    const at = (n: string) => s.scaled[t]![fixture.findIndex((c) => c.buildingNumber === n)]!;
    expect(at('104')).toBe(0); // evaluated on asOf
    expect(at('103')).toBe(1); // never
    expect(at('108')).toBe(1); // 6.5 years
    expect(at('106')).toBeCloseTo(731 / 365.25 / 4, 12); // 2023-06-30 → 2025-06-30: 731 days
  });
});

describe('audit priority: ordering', () => {
  it('with only the excess-energy weight, orders by excess kBtu (hand computed above)', () => {
    expect(order(fixture, only('excessEnergy'))).toEqual([
      '103',
      '105',
      '108',
      '102',
      '101',
      '104',
      '106',
      '107', // all zero: building number ascending
    ]);
  });

  it('with only the evaluation weight, the overdue come first, ties by excess kBtu', () => {
    // 101, 103, 105, 108 are all ≥ 4 years or never (scaled 1); among them excess decides:
    // 103 (1,356,000) > 105 (536,800) > 108 (441,000) > 101 (267,500); then 107 (3 y), 106 (2 y),
    // 102 (1.47 y), 104 (0 y)
    expect(order(fixture, only('evaluationAge'))).toEqual([
      '103',
      '105',
      '108',
      '101',
      '107',
      '106',
      '102',
      '104',
    ]);
  });

  it('changing the weights changes the order as documented', () => {
    const byExcess = order(fixture, only('excessEnergy'));
    const byFlag = order(fixture, { ...only('manualFlag'), excessEnergy: 0.001 });
    // The manual flag lifts 105 above 103, which leads on excess alone.
    expect(byExcess[0]).toBe('103');
    expect(byFlag[0]).toBe('105');
    expect(byFlag[1]).toBe('103');
  });

  it('a building made worse rises', () => {
    const before = order(fixture, DEFAULT_PRIORITY_WEIGHTS).indexOf('102');
    const worse = fixture.map((c) =>
      c.buildingNumber === '102' ? { ...c, euiNormalized: 150 } : c,
    );
    const after = order(worse, DEFAULT_PRIORITY_WEIGHTS).indexOf('102');
    expect(after).toBeLessThan(before);
  });

  it('weights are normalized: {30, 20, …} and {0.3, 0.2, …} give the same scores', () => {
    const scaled = Object.fromEntries(
      PRIORITY_TERMS.map((t) => [t, DEFAULT_PRIORITY_WEIGHTS[t] / 100]),
    ) as PriorityWeights;
    const a = scorePriority(fixture, DEFAULT_PRIORITY_WEIGHTS, { asOf });
    const b = scorePriority(fixture, scaled, { asOf });
    a.score.forEach((s, i) => expect(b.score[i]).toBeCloseTo(s, 10));
  });
});

describe('audit priority: ties', () => {
  const twin = (id: string, number: string): PriorityCandidate => ({
    ...fixture[1]!,
    buildingId: id,
    buildingNumber: number,
  });

  it('breaks a full tie by building number, numerically, then by id', () => {
    const a = [twin('x', '1204'), twin('y', '98'), twin('z', '98')];
    expect(
      rankPriority(a, DEFAULT_PRIORITY_WEIGHTS, { asOf }).map((r) => r.candidate.buildingId),
    ).toEqual(['y', 'z', 'x']);
  });

  it('gives the same order whatever the input order (property)', () => {
    const idx = fixture.map((_, i) => i);
    const ids = (c: PriorityCandidate[]) =>
      rankPriority(c, only('evaluationAge'), { asOf }).map((r) => r.candidate.buildingId);
    const reference = ids(fixture);
    fc.assert(
      fc.property(
        fc.shuffledSubarray(idx, { minLength: idx.length, maxLength: idx.length }),
        (perm) => {
          expect(ids(perm.map((i) => fixture[i]!))).toEqual(reference);
        },
      ),
    );
  });
});

// Random candidates for the properties below (constructed).
const candidateArb = fc.record({
  buildingId: fc.uuid(),
  buildingNumber: fc.integer({ min: 1, max: 999 }).map(String),
  useType: fc.constantFrom(...USE_TYPES),
  areaFt2: fc.integer({ min: 500, max: 500_000 }),
  euiNormalized: fc.option(fc.double({ min: 0, max: 800, noNaN: true }), { nil: null }),
  pricePerKbtu: fc.option(fc.double({ min: 0, max: 0.2, noNaN: true }), { nil: null }),
  yoy: fc.option(
    fc.record({
      current: fc.integer({ min: 0, max: 1e7 }),
      previous: fc.integer({ min: 0, max: 1e7 }),
    }),
    { nil: null },
  ),
  anomalies: fc.option(
    fc.record({
      recentPeriods: fc.constant(12),
      beyond2Se: fc.integer({ min: 0, max: 12 }),
      largestSe: fc.constant(null),
    }),
    { nil: null },
  ),
  lastEvaluated: fc.option(
    fc.constantFrom('2015-01-01', '2021-10-01', '2024-05-05', '2025-06-30'),
    { nil: null },
  ),
  manualFlag: fc.boolean(),
  flagReason: fc.constant(null),
});
const weightsArb = fc.record({
  excessEnergy: fc.integer({ min: 0, max: 50 }),
  excessCost: fc.integer({ min: 0, max: 50 }),
  yoyIncrease: fc.integer({ min: 0, max: 50 }),
  anomalies: fc.integer({ min: 0, max: 50 }),
  evaluationAge: fc.integer({ min: 0, max: 50 }),
  manualFlag: fc.integer({ min: 1, max: 50 }),
});

describe('audit priority: properties', () => {
  it('scaled terms lie in [0, 1]; points add up to the score; score in [0, 100]', () => {
    fc.assert(
      fc.property(
        fc.array(candidateArb, { minLength: 1, maxLength: 40 }),
        weightsArb,
        (cands, w) => {
          const ranked = rankPriority(cands, w, { asOf });
          for (const r of ranked) {
            const terms = r.breakdown!.terms;
            let points = 0;
            for (const t of terms) {
              expect(t.scaled).toBeGreaterThanOrEqual(0);
              expect(t.scaled).toBeLessThanOrEqual(1);
              points += t.points;
            }
            expect(points).toBeCloseTo(r.score, 9);
            expect(r.score).toBeGreaterThanOrEqual(0);
            expect(r.score).toBeLessThanOrEqual(100 + 1e-9);
          }
          for (let i = 1; i < ranked.length; i++)
            expect(ranked[i - 1]!.score).toBeGreaterThanOrEqual(ranked[i]!.score);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('raising one building’s EUI never lowers its score or its rank', () => {
    fc.assert(
      fc.property(
        fc.array(candidateArb, { minLength: 2, maxLength: 30 }),
        fc.nat(),
        fc.double({ min: 1, max: 500, noNaN: true }),
        weightsArb,
        (cands, k, delta, w) => {
          const i = k % cands.length;
          const worse = cands.map((c, j) =>
            j === i ? { ...c, euiNormalized: (c.euiNormalized ?? 0) + delta } : c,
          );
          const a = scorePriority(cands, w, { asOf });
          const b = scorePriority(worse, w, { asOf });
          expect(b.score[i]!).toBeGreaterThanOrEqual(a.score[i]! - 1e-9);
          expect(b.rank[i]!).toBeLessThanOrEqual(a.rank[i]!);
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('audit priority: breakdown', () => {
  const ranked = rankPriority(fixture, DEFAULT_PRIORITY_WEIGHTS, { asOf });
  const get = (n: string) => ranked.find((r) => r.candidate.buildingNumber === n)!;

  it('explains the excess against the CBECS median in words', () => {
    // 80.25 / 53.5 = 1.5 → 50 % above the CBECS 2018 office median (Table C12)
    expect(get('101').breakdown!.explanation).toContain(
      'Uses 50 % more energy per square foot than the median office building (CBECS 2018): 80.3 vs 53.5 kBtu/ft²·yr, about 267,500 kBtu a year above the median.',
    );
  });

  it('names the fiscal year of the last evaluation', () => {
    // 2021-03-15 is in FY2021 (31 U.S.C. 1102); 4.3 years before 2025-06-30
    expect(
      get('101').breakdown!.explanation.some((s) =>
        s.startsWith('Not evaluated since FY2021 (4.3 years ago)'),
      ),
    ).toBe(true);
    expect(
      get('103').breakdown!.explanation.some((s) => s.startsWith('No evaluation on record')),
    ).toBe(true);
  });

  it('reports each term with its unit and a null raw value when the input is missing', () => {
    const t = get('107').breakdown!.terms;
    expect(t.map((x) => x.unit)).toEqual([
      'kBtu/yr',
      '$/yr',
      'fraction',
      'periods',
      'years',
      'flag',
    ]);
    expect(t[0]!.raw).toBeNull();
    expect(t[0]!.points).toBe(0);
    expect(t[4]!.raw).toBeCloseTo(3, 2); // 2022-06-30 → 2025-06-30
  });

  it('orders the sentences by contribution and quotes the manager’s reason', () => {
    // Hand computed for 105 with the default weights (caps: type-7 p95 of the positive values):
    // yoy 0.20 ≥ cap 0.19 → 1 × 15 = 15 points; evaluation 4.75 y ≥ 4 → 1 × 15 = 15;
    // flag 1 × 10 = 10; excess 536,800 / 1,192,160 × 30 ≈ 13.5; cost 21,472 / 31,414.4 × 20 ≈ 13.7;
    // anomalies 4 ≥ cap 3.8 → 10. Ties keep the term order, so the rise in use comes first.
    const b = get('105').breakdown!;
    const points = Object.fromEntries(b.terms.map((t) => [t.term, t.points]));
    expect(points['yoyIncrease']).toBeCloseTo(15, 9);
    expect(points['evaluationAge']).toBeCloseTo(15, 9);
    expect(points['excessEnergy']).toBeCloseTo((536_800 / 1_192_160) * 30, 9);
    expect(points['excessCost']).toBeCloseTo((21_472 / 31_414.4) * 20, 9);
    expect(b.explanation[0]).toBe('Weather-normalized use rose 20 % over the previous year.');
    expect(b.explanation[1]).toMatch(/^Not evaluated since FY2021 \(4\.7 years ago\)/);
    expect(b.explanation).toContain('Flagged by a manager: Kitchen hoods run all night.');
  });

  it('builds breakdowns only for the top rows when asked', () => {
    const r = rankPriority(fixture, DEFAULT_PRIORITY_WEIGHTS, { asOf, explainTop: 3 });
    expect(r.filter((x) => x.breakdown !== null)).toHaveLength(3);
    expect(r[3]!.breakdown).toBeNull();
    expect(r[3]!.score).toBeGreaterThan(0);
  });

  it('counts evaluation age in calendar days across leap years', () => {
    // Reference: JavaScript Date.UTC day arithmetic (ECMA-262 proleptic Gregorian calendar)
    const old = { ...fixture[0]!, lastEvaluated: '1999-12-31' };
    const s = scorePriority([old], DEFAULT_PRIORITY_WEIGHTS, { asOf: '2025-06-30' });
    const days = (Date.UTC(2025, 5, 30) - Date.UTC(1999, 11, 31)) / 86_400_000;
    expect(s.raw[PRIORITY_TERMS.indexOf('evaluationAge')]![0]).toBeCloseTo(days / 365.25, 12);
  });
});

describe('priority weights', () => {
  it('defaults sum to 100 points and normalize to shares', () => {
    expect([...normalizeWeights(DEFAULT_PRIORITY_WEIGHTS)]).toEqual([
      0.3, 0.2, 0.15, 0.1, 0.15, 0.1,
    ]);
  });

  it('rejects negative weights and an all-zero set', () => {
    expect(priorityWeightsSchema.safeParse(DEFAULT_PRIORITY_WEIGHTS).success).toBe(true);
    expect(
      priorityWeightsSchema.safeParse({ ...DEFAULT_PRIORITY_WEIGHTS, anomalies: -1 }).success,
    ).toBe(false);
    expect(priorityWeightsSchema.safeParse({ ...only('manualFlag'), manualFlag: 0 }).success).toBe(
      false,
    );
  });
});
