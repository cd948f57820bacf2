import { describe, expect, it } from 'vitest';
import { USE_TYPES } from '../../../src/lib/domain';
import {
  nationalPeer,
  quartilePosition,
  USE_TYPE_TO_CBECS,
} from '../../../src/lib/benchmark/peers';

describe('nationalPeer', () => {
  it('maps every use type to a row with a median and quartiles', () => {
    for (const u of USE_TYPES) {
      const p = nationalPeer(u);
      expect(Number.isFinite(p.row.median)).toBe(true);
      expect(p.source).toMatch(/CBECS 2018, Table C12/);
    }
  });

  it.each([
    // Source: EIA CBECS 2018 Table C12 medians of the mapped rows
    ['office', 'Office', 53.5],
    ['lodging', 'Lodging', 86.1],
    ['training', 'Education', 48.6],
    ['warehouse', 'Warehouse and storage', 14.0],
    ['dining', 'Food service', 232.9],
    ['clinic', 'Outpatient', 60.6],
    ['fitness', 'Recreation', 53.2],
    ['laboratory', 'Laboratory', 86.4],
    ['vehicle_maintenance', 'Vehicle storage or maintenance', 29.4],
    ['religious', 'Religious worship', 32.9],
    ['retail', 'Retail (other than mall)', 40.8],
  ] as const)('%s → %s (median %d)', (useType, activity, median) => {
    const p = nationalPeer(useType);
    expect(p.row.activity).toBe(activity);
    expect(p.row.median).toBe(median);
    expect(p.match).toBe('mapped');
  });

  it('falls back to All buildings for a data center (no CBECS 2018 row)', () => {
    // Source: EIA CBECS 2018 Table C12 has no data-center row; All buildings median 45.0
    expect(USE_TYPE_TO_CBECS.data_center).toBeNull();
    const p = nationalPeer('data_center');
    expect(p.row.activity).toBe('All buildings');
    expect(p.row.median).toBe(45.0);
    expect(p.match).toBe('all-buildings');
  });

  it('uses an override row, e.g. barracks as dormitories', () => {
    // Source: EIA CBECS 2018 Table C12, "Dormitory, fraternity, or sorority" median 103.0
    const p = nationalPeer('lodging', 'Dormitory, fraternity, or sorority');
    expect(p.row.median).toBe(103.0);
    expect(p.match).toBe('mapped');
  });

  it('climbs to the parent row when the requested row is withheld (Q)', () => {
    // Source: EIA CBECS 2018 Table C12: "Other food sales" is Q; its parent Food sales median 215.2
    const p = nationalPeer('retail', 'Other food sales');
    expect(p.row.activity).toBe('Food sales');
    expect(p.row.median).toBe(215.2);
    expect(p.match).toBe('parent');
    expect(p.requested).toBe('Other food sales');
  });

  it('ignores an unknown override label', () => {
    expect(nationalPeer('office', 'Spaceport').row.activity).toBe('Office');
  });
});

describe('quartilePosition', () => {
  const office = nationalPeer('office'); // p25 36.3, median 53.5, p75 77.2 (CBECS 2018 C12)

  it('places 70 kBtu/ft² between the office median and 75th percentile', () => {
    // Source: benchmark-reference §6 quick check, Table C12: 70 > 53.5 and < 77.2
    expect(quartilePosition(70, office).band).toBe('third');
  });

  it('puts each boundary in the upper band (constructed)', () => {
    expect(quartilePosition(36.29, office).band).toBe('first');
    expect(quartilePosition(36.3, office).band).toBe('second');
    expect(quartilePosition(53.5, office).band).toBe('third');
    expect(quartilePosition(77.2, office).band).toBe('fourth');
  });

  it('reports the distance from the median as a fraction', () => {
    // 80.25 = 1.5 × 53.5 (hand arithmetic) → +50 %
    expect(quartilePosition(80.25, office).vsMedian).toBeCloseTo(0.5, 12);
  });
});
