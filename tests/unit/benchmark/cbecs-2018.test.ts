import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { CBECS_2018_C12, cbecsRow } from '../../../src/lib/benchmark/cbecs-2018';

// Fixture: tests/fixtures/cbecs/cbecs-2018-eui.csv, a transcription of EIA CBECS 2018 Table C12
// (source note beside it in cbecs-2018-eui.md).
function fixtureRows(): Record<string, string>[] {
  const text = readFileSync(
    new URL('../../fixtures/cbecs/cbecs-2018-eui.csv', import.meta.url),
    'utf8',
  );
  const body = text.slice(text.indexOf('\n') + 1); // first line is the source comment
  return Papa.parse<Record<string, string>>(body, { header: true, skipEmptyLines: true }).data;
}

const num = (s: string | undefined) => (s === undefined || s === '' ? null : Number(s));

describe('CBECS 2018 Table C12 medians', () => {
  it.each([
    ['Office', 53.5],
    ['Education', 48.6],
    ['Lodging', 86.1],
    ['Warehouse and storage', 14.0],
    ['All buildings', 45.0],
  ])('%s median site EUI is %d kBtu/ft²', (activity, median) => {
    // Source: EIA CBECS 2018 Table C12 (methods.md §7 test vectors)
    expect(cbecsRow(activity)?.median).toBe(median);
  });

  it('reads back the quartiles and mean of the office row', () => {
    // Source: EIA CBECS 2018 Table C12, Office: mean 65.6, p25 36.3, median 53.5, p75 77.2
    expect(cbecsRow('Office')).toMatchObject({ mean: 65.6, p25: 36.3, median: 53.5, p75: 77.2 });
  });

  it('keeps withheld (Q) cells as null', () => {
    // Source: EIA CBECS 2018 Table C12: "Other food sales" is withheld in every column
    expect(cbecsRow('Other food sales')).toMatchObject({
      mean: null,
      p25: null,
      median: null,
      p75: null,
    });
  });

  it('matches the fixture transcription row by row (69 rows, same order)', () => {
    const rows = fixtureRows();
    expect(rows).toHaveLength(69);
    expect(CBECS_2018_C12).toHaveLength(rows.length);
    rows.forEach((r, i) => {
      const m = CBECS_2018_C12[i]!;
      expect(m.activity).toBe(r['building_activity']);
      expect(m.parent).toBe(r['parent'] === '' ? null : r['parent']);
      expect(m.mean).toBe(num(r['mean_site_eui_kbtu_per_sqft']));
      expect(m.p25).toBe(num(r['p25_site_eui_kbtu_per_sqft']));
      expect(m.median).toBe(num(r['median_site_eui_kbtu_per_sqft']));
      expect(m.p75).toBe(num(r['p75_site_eui_kbtu_per_sqft']));
    });
  });

  it('every published row has p25 ≤ median ≤ p75', () => {
    // Source: definition of quartiles (the table's building-level distribution)
    for (const r of CBECS_2018_C12) {
      if (r.p25 === null || r.median === null || r.p75 === null) continue;
      expect(r.p25).toBeLessThanOrEqual(r.median);
      expect(r.median).toBeLessThanOrEqual(r.p75);
    }
  });
});
