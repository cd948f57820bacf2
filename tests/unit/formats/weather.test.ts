import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseWeatherCsv, parseWeatherCsvText } from '../../../src/lib/formats/weather-csv';
import { parseWeatherJson } from '../../../src/lib/formats/weather-json';

// Constructed fixture in the NCEI daily-summaries CSV shape (invented station and values):
// tests/fixtures/imports/weather-daily-summaries.csv, requested with units=standard (°F).
const path = fileURLToPath(new URL('../../fixtures/imports/weather-daily-summaries.csv', import.meta.url));
const fixture = readFileSync(path, 'utf8');

describe('daily-summaries CSV', () => {
  it('lists the problems of each line, read by hand from the fixture', () => {
    const r = parseWeatherCsvText(fixture, { units: 'standard' });
    if (!r.ok) throw new Error(r.message);
    // line 4: Tmin 35 > Tmax 31; line 5: Tmax 150 °F beyond the world record 134.1 °F;
    // line 6: Tmin -80 °F at the US record low (warning, day kept); line 7: 2024-01-05 again;
    // line 8: 2024-02-30 does not exist; line 9: Tmax has quality flag I (dropped to missing).
    expect(r.problems.map(({ row, column, code, severity }) => [row, column, code, severity])).toEqual([
      [4, 'TMIN', 'tmin-above-tmax', 'error'],
      [5, 'TMAX', 'temperature-out-of-range', 'error'],
      [6, 'TMIN', 'temperature-suspect', 'warning'],
      [7, 'DATE', 'duplicate-date', 'error'],
      [8, 'DATE', 'impossible-date', 'error'],
      [9, 'TMAX', 'qc-flagged', 'warning'],
    ]);
    expect(r.problems[3]?.message).toContain('row 6');
    expect(r.days).toEqual([
      { station: 'XXC00000001', date: '2024-01-01', tmaxF: 39, tminF: 25 },
      { station: 'XXC00000001', date: '2024-01-02', tmaxF: null, tminF: 20 },
      { station: 'XXC00000001', date: '2024-01-05', tmaxF: -70, tminF: -80 },
      { station: 'XXC00000001', date: '2024-01-06', tmaxF: null, tminF: 30 },
      { station: 'XXC00000001', date: '2024-01-07', tmaxF: 41, tminF: 28 },
    ]);
    expect(r.counts).toEqual({ records: 9, valid: 5, rejected: 4, emptyRows: 0, missingValues: 2 });
  });

  it('converts °C and tenths of °C to °F', () => {
    // Source: NIST SP 811 (2008) §B.9, t/°F = 1.8 t/°C + 32: 0 °C = 32 °F, 25 °C = 77 °F,
    // -40 °C = -40 °F; 100 °C = 212 °F is beyond any air temperature record and refused.
    const metric = parseWeatherCsvText('STATION,DATE,TMAX,TMIN\nX,2024-07-01,25,0\nX,2024-07-02,-40,-40.5\nX,2024-07-03,100,20\n', { units: 'metric' });
    expect(metric).toMatchObject({ ok: true, days: [{ tmaxF: 77, tminF: 32 }, { tmaxF: -40, tminF: -40.9 }] });
    if (metric.ok) expect(metric.problems).toMatchObject([{ row: 4, code: 'temperature-out-of-range', message: expect.stringContaining('212 °F') }]);
    // Without `units` the service returns GHCN's stored tenths of °C, space-padded (GHCN-Daily readme §III).
    const tenths = parseWeatherCsvText('"STATION","DATE","TMAX","TMIN"\n"X","2024-07-01","   250","    0"\n"X","2024-07-02","  -61","  -400"\n', { units: 'tenths-C' });
    expect(tenths).toMatchObject({ ok: true, days: [{ tmaxF: 77, tminF: 32 }, { tmaxF: 21.02, tminF: -40 }] });
  });

  it('converts every tenth of a degree C to °F exactly as 1.8 C + 32 (NIST SP 811 §B.9)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -600, max: 500 }), (tenths) => {
        const r = parseWeatherCsvText(`STATION,DATE,TMAX,TMIN\nX,2024-07-01,${tenths},\n`, { units: 'tenths-C' });
        const expected = Math.round((tenths * 18 + 3200) * 100) / 1e4; // integer arithmetic: °F × 10^4
        expect(r).toMatchObject({ ok: true, days: [{ tmaxF: expected }] });
      }),
    );
  });

  it('uses the stated station and refuses rows of another one', () => {
    const r = parseWeatherCsvText('DATE,TMAX,TMIN\n2024-01-01,40,30\n', { units: 'F', station: 'XXC00000001' });
    expect(r).toMatchObject({ ok: true, days: [{ station: 'XXC00000001' }] });
    const other = parseWeatherCsvText(fixture, { units: 'F', station: 'XXC00000002' });
    expect(other).toMatchObject({ ok: true, days: [], counts: { valid: 0 } });
    if (other.ok) expect(other.problems.filter((p) => p.code === 'other-station')).toHaveLength(9);
  });

  it('reads the same from a stream of bytes', async () => {
    async function* chunks(): AsyncGenerator<Uint8Array> {
      const bytes = new TextEncoder().encode(fixture);
      for (let i = 0; i < bytes.length; i += 17) yield bytes.subarray(i, i + 17);
    }
    expect(await parseWeatherCsv(chunks(), { units: 'standard' })).toEqual(parseWeatherCsvText(fixture, { units: 'standard' }));
  });

  it('refuses files without the daily-summaries columns and unusable options', () => {
    expect(parseWeatherCsvText('Meter,Start\nA,1\n', { units: 'F' })).toMatchObject({ ok: false, reason: 'no-mappable-columns' });
    expect(parseWeatherCsvText('STATION,DATE,TMAX\nX,2024-01-01,3\n', { units: 'F' })).toMatchObject({
      ok: false,
      reason: 'missing-columns',
      message: expect.stringContaining('TMIN'),
    });
    expect(parseWeatherCsvText(fixture, { units: 'kelvin' } as never)).toMatchObject({ ok: false, reason: 'options-invalid' });
    expect(parseWeatherCsvText('', { units: 'F' })).toMatchObject({ ok: false, reason: 'empty-file' });
  });
});

describe('daily-summaries JSON', () => {
  it('reads the service JSON shape without units (space-padded tenths of °C)', () => {
    // Response shape of the NCEI Access Data Service with format=json and no units: string
    // values, space-padded GHCN integers (data-standards notes §2.2). 200 = 20.0 °C = 68 °F;
    // 61 = 6.1 °C = 1.8 × 6.1 + 32 = 42.98 °F (NIST SP 811 §B.9).
    const r = parseWeatherJson('[{"DATE":"2020-12-31","STATION":"USW00023174","TMAX":"  200","TMIN":"   61","PRCP":"    0"}]', { units: 'tenths-C' });
    expect(r).toMatchObject({ ok: true, days: [{ station: 'USW00023174', date: '2020-12-31', tmaxF: 68, tminF: 42.98 }], problems: [] });
  });

  it('reads units=standard JSON, absent elements as missing, and names records by position', () => {
    const json = [
      { DATE: '2024-08-01', STATION: 'XXC00000001', TMAX: '87', TMIN: '74' },
      { DATE: '2024-08-02', STATION: 'XXC00000001', TMIN: '70' },
      { DATE: '2024-08-03', STATION: 'XXC00000001', TMAX: '60', TMIN: '75' },
      { DATE: '2024-08-01', STATION: 'XXC00000001', TMAX: '80', TMIN: '70' },
    ];
    const r = parseWeatherJson(JSON.stringify(json), { units: 'standard' });
    if (!r.ok) throw new Error(r.message);
    expect(r.days).toEqual([
      { station: 'XXC00000001', date: '2024-08-01', tmaxF: 87, tminF: 74 },
      { station: 'XXC00000001', date: '2024-08-02', tmaxF: null, tminF: 70 },
    ]);
    expect(r.problems.map((p) => [p.row, p.column, p.code])).toEqual([
      [3, 'TMIN', 'tmin-above-tmax'],
      [4, 'DATE', 'duplicate-date'],
    ]);
    expect(parseWeatherJson(json, { units: 'standard' })).toEqual(r);
  });

  it('refuses text that is not JSON or not an array of records', () => {
    expect(parseWeatherJson('{"oops"', { units: 'F' })).toMatchObject({ ok: false, reason: 'malformed-json' });
    expect(parseWeatherJson('{"DATE":"2024-01-01"}', { units: 'F' })).toMatchObject({ ok: false, reason: 'malformed-json' });
    expect(parseWeatherJson('[[1,2]]', { units: 'F' })).toMatchObject({ ok: false, reason: 'malformed-json' });
    expect(parseWeatherJson(' ', { units: 'F' })).toMatchObject({ ok: false, reason: 'empty-file' });
  });
});
