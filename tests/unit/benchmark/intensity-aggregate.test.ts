import { describe, expect, it } from 'vitest';
import { buildingIntensity, type BuildingUsage } from '../../../src/lib/benchmark/intensity';
import { aggregateBy, aggregateIntensity } from '../../../src/lib/benchmark/intensity-aggregate';
import { fiscalYearWindow } from '../../../src/lib/benchmark/windows';

const FY2024 = fiscalYearWindow(2024);

const b = (
  id: string,
  areaFt2: number,
  kbtu: number | null,
  u?: number,
  covered = 366,
): BuildingUsage => ({
  buildingId: id,
  areaFt2,
  uses:
    kbtu === null
      ? []
      : [
          {
            commodity: 'electricity',
            quantity: kbtu,
            coveredDays: covered,
            normalizedAnnualKbtu: kbtu,
            normalizedUncertaintyKbtu: u ?? null,
          },
        ],
});

// Constructed installation: A 1,000,000 kBtu on 10,000 ft² (EUI 100); B 500,000 kBtu on 40,000 ft²
// (EUI 12.5); C 20,000 ft² with no bills.
const A = buildingIntensity(b('A', 10_000, 1_000_000, 30_000), FY2024);
const B = buildingIntensity(b('B', 40_000, 500_000, 40_000, 183), FY2024);
const C = buildingIntensity(b('C', 20_000, null), FY2024);

describe('aggregateIntensity', () => {
  it('is Σ energy / Σ area (1,500,000 / 50,000 = 30), not the mean of ratios (56.25)', () => {
    // Source: methods §5 (floor-area-weighted intensity); hand arithmetic
    const r = aggregateIntensity([A, B, C], 'siteEui');
    expect(r).toMatchObject({
      ok: true,
      value: 30,
      total: 1_500_000,
      buildingsIncluded: 2,
      buildingsTotal: 3,
      areaIncludedFt2: 50_000,
      areaTotalFt2: 70_000,
    });
  });

  it('weights coverage by area: (1 × 10,000 + 0.5 × 40,000) / 50,000 = 0.6', () => {
    const r = aggregateIntensity([A, B, C], 'siteEui');
    expect(r.ok && r.coverage).toBeCloseTo(0.6, 12);
    expect(r.ok && r.minCoverage).toBe(0.5);
  });

  it('combines uncertainties in quadrature: √(30,000² + 40,000²) / 50,000 = 1', () => {
    // Source: GUM (JCGM 100:2008) §5.1, uncorrelated inputs
    const r = aggregateIntensity([A, B, C], 'normalizedEui');
    expect(r.ok && r.uncertainty).toBeCloseTo(1, 12);
  });

  it('says no-data when no building has the figure', () => {
    expect(aggregateIntensity([C], 'wui')).toEqual({
      ok: false,
      reason: 'no-data',
      buildingsTotal: 1,
      areaTotalFt2: 20_000,
    });
  });
});

describe('aggregateBy', () => {
  it('aggregates each installation separately', () => {
    const inst: Record<string, string> = { A: 'north', B: 'south', C: 'north' };
    const m = aggregateBy([A, B, C], (x) => inst[x.buildingId]!, 'siteEui');
    expect(m.get('north')).toMatchObject({
      ok: true,
      value: 100,
      buildingsIncluded: 1,
      buildingsTotal: 2,
    });
    expect(m.get('south')).toMatchObject({ ok: true, value: 12.5 });
  });
});
