import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { greenButtonBillRows, parseGreenButton } from '../../../src/lib/formats/green-button';
import { decodeDstRule, type EspiLocalTime, localOffset, ruleDay } from '../../../src/lib/formats/green-button-time';

// The sample feed tests/fixtures/schemas/greenbutton-dmd-example.xml (synthetic data, validated
// against the official schema in green-button-schema.test.ts). Expected values are computed by
// hand from the XML; mutated copies below are constructed variants of it.
const example = readFileSync(fileURLToPath(new URL('../../fixtures/schemas/greenbutton-dmd-example.xml', import.meta.url)), 'utf8');

function parsed(xml: string) {
  const r = parseGreenButton(xml);
  if (!r.ok) throw new Error(r.message);
  return r;
}

describe('the sample feed imports to the right kWh and therms', () => {
  it('sums the electricity intervals into one January period', () => {
    const electric = parsed(example).series.find((s) => s.commodity === 'electricity');
    // By hand: ReadingType/1 has uom 72 (Wh) and powerOfTenMultiplier 0, so
    //   kWh = (412345 + 398760 + 405112) × 10^0 / 1000 = 1216217 / 1000 = 1216.217 kWh.
    // Cost is in hundred-thousandths of USD (currency 840):
    //   (4886288 + 4725306 + 4800577) / 100000 = 14412171 / 100000 = $144.12171.
    // Dates: starts 1735711200, 1735797600, 1735884000 s, each 86400 s long; with tzOffset
    //   -21600 s (UTC-6, January is outside DST) 1735711200 - 21600 = 1735689600 = 20089 days
    //   = 2025-01-01 00:00 local, so the readings cover 2025-01-01 .. 2025-01-03 inclusive.
    // The third reading has ReadingQuality 8 (estimated using reference day).
    expect(electric).toMatchObject({
      source: 'intervals',
      unit: 'kWh',
      currency: 840,
      timeZone: { tzOffsetSeconds: -21600, dst: true },
      periods: [{ periodStart: '2025-01-01', periodEnd: '2025-01-03', unit: 'kWh', estimated: true, readings: 3 }],
    });
    expect(electric?.periods[0]?.quantity).toBeCloseTo(1216.217, 9);
    expect(electric?.periods[0]?.cost).toBeCloseTo(144.12171, 9);
  });

  it('takes the gas bill from the UsageSummary', () => {
    const gas = parsed(example).series.find((s) => s.commodity === 'natural_gas');
    // By hand: overallConsumptionLastPeriod value 18734, uom 169 (therm), multiplier -2:
    //   18734 × 10^-2 = 187.34 therm. billLastPeriod 19670700 / 100000 = $196.707.
    // billingPeriod start 1735884000 = 2025-01-03 00:00 UTC-6, duration 2678400 s = 31 days,
    //   so the period is 2025-01-03 .. 2025-02-02 inclusive (31 days).
    expect(gas).toMatchObject({
      source: 'usage-summary',
      unit: 'therm',
      periods: [{ periodStart: '2025-01-03', periodEnd: '2025-02-02', unit: 'therm', estimated: false }],
    });
    expect(gas?.periods[0]?.quantity).toBeCloseTo(187.34, 9);
    expect(gas?.periods[0]?.cost).toBeCloseTo(196.707, 9);
  });

  it('gives the same gas quantity from the interval reading when the summary is removed', () => {
    const withoutSummary = example.replace(/<!-- 3\. The gas bill[\s\S]*?<\/entry>/, '');
    expect(withoutSummary).not.toBe(example);
    const gas = parsed(withoutSummary).series.find((s) => s.commodity === 'natural_gas');
    // The one IntervalReading: value 18734 × 10^-2 = 187.34 therm, cost 19670700 / 100000,
    // 2678400 s (31 days, a bill period by itself) from 2025-01-03 local.
    expect(gas?.source).toBe('intervals');
    expect(gas?.periods).toHaveLength(1);
    expect(gas?.periods[0]).toMatchObject({ periodStart: '2025-01-03', periodEnd: '2025-02-02', readings: 1 });
    expect(gas?.periods[0]?.quantity).toBeCloseTo(187.34, 9);
    expect(gas?.periods[0]?.cost).toBeCloseTo(196.707, 9);
  });

  it('turns series into bill rows for a meter', () => {
    const gas = parsed(example).series.find((s) => s.commodity === 'natural_gas');
    if (gas === undefined) throw new Error('no gas series');
    expect(greenButtonBillRows(gas, 'B-101-G')).toEqual([
      { meterCode: 'B-101-G', periodStart: '2025-01-03', periodEnd: '2025-02-02', quantity: gas.periods[0]?.quantity, unit: 'therm', cost: gas.periods[0]?.cost, demandKw: undefined, estimated: false },
    ]);
  });
});

describe('unit code and power-of-ten multiplier (constructed variants of the sample)', () => {
  it('reads values sent as kWh (multiplier 3) as kWh', () => {
    const xml = example.replace('<powerOfTenMultiplier>0</powerOfTenMultiplier>  <!-- x 10^0 -->', '<powerOfTenMultiplier>3</powerOfTenMultiplier>');
    expect(xml).not.toBe(example);
    // 1216217 × 10^3 / 1000 = 1216217 kWh.
    expect(parsed(xml).series[0]?.periods[0]?.quantity).toBe(1216217);
  });

  it('leaves out received energy and demand readings with a note', () => {
    const exported = parsed(example.replace('<flowDirection>1</flowDirection>                <!-- forward', '<flowDirection>19</flowDirection> <!--'));
    expect(exported.series.map((s) => s.commodity)).toEqual(['natural_gas']);
    expect(exported.notes.map((n) => n.code)).toContain('export-skipped');
    const demand = parsed(example.replace('<uom>72</uom>', '<uom>38</uom>'));
    expect(demand.notes.map((n) => n.code)).toContain('demand-skipped');
  });
});

describe('local dates', () => {
  it('falls back to UTC with a note when the feed has no LocalTimeParameters', () => {
    const xml = example.replace(/<entry>\s*<id>urn:uuid:03481cca[\s\S]*?<\/entry>/, '');
    const r = parsed(xml);
    // In UTC the readings run from 2025-01-01 06:00Z to 2025-01-04 06:00Z, so the last local
    // date is 2025-01-04.
    expect(r.series[0]?.periods[0]).toMatchObject({ periodStart: '2025-01-01', periodEnd: '2025-01-04' });
    expect(r.notes.map((n) => n.code)).toContain('no-local-time');
  });

  it('keeps a summer day on its own date thanks to the DST rules', () => {
    // 2025-07-01 00:00 CDT = 05:00Z = Date.UTC(2025, 6, 1, 5) / 1000 = 1751346000.
    const start = Date.UTC(2025, 6, 1, 5) / 1000;
    const xml = example.replaceAll('1735711200', String(start)).replace('<start>1735797600</start>', `<start>${start + 86400}</start>`).replace('<start>1735884000</start>\n          </timePeriod>\n          <value>405112', `<start>${start + 2 * 86400}</start>\n          </timePeriod>\n          <value>405112`);
    const electric = parsed(xml).series.find((s) => s.commodity === 'electricity');
    expect(electric?.periods[0]).toMatchObject({ periodStart: '2025-07-01', periodEnd: '2025-07-03' });
  });

  it('decodes the DST rules of the sample as the US rule', () => {
    // Source: 15 U.S.C. 260a (Energy Policy Act of 2005 §110): DST runs from 2:00 a.m. on the
    // second Sunday of March to 2:00 a.m. on the first Sunday of November.
    const start = decodeDstRule('360E2000');
    const end = decodeDstRule('B40E2000');
    expect(start).toEqual({ month: 3, operator: 3, dayOfMonth: 0, dayOfWeek: 7, secondsOfDay: 7200 });
    expect(end).toEqual({ month: 11, operator: 2, dayOfMonth: 0, dayOfWeek: 7, secondsOfDay: 7200 });
    if (start === null || end === null) return;
    expect(ruleDay(start, 2025)).toBe(9); // Sunday 9 March 2025
    expect(ruleDay(end, 2025)).toBe(2); // Sunday 2 November 2025
    expect(decodeDstRule('FFFFFFFF')).toBeNull();
  });

  it('gives the same UTC offset as the IANA time zone America/Chicago (Intl) at any instant 2007-2037', () => {
    // Reference: the IANA tz database through Intl.DateTimeFormat (ICU). US rules since 2007.
    const lt: EspiLocalTime = { tzOffset: -21600, dstOffset: 3600, dstStart: decodeDstRule('360E2000'), dstEnd: decodeDstRule('B40E2000') };
    const f = new Intl.DateTimeFormat('en-US', { timeZone: 'America/Chicago', timeZoneName: 'longOffset' });
    const ianaOffset = (t: number): number => {
      const name = f.formatToParts(new Date(t * 1000)).find((p) => p.type === 'timeZoneName')?.value ?? '';
      const m = /GMT([+-])(\d{2}):(\d{2})/.exec(name);
      return m === null ? 0 : (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 3600 + Number(m[3]) * 60);
    };
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(2007, 0, 1) / 1000, max: Date.UTC(2037, 11, 31) / 1000 }), (t) => {
        expect(localOffset(t, lt)).toBe(ianaOffset(t));
      }),
      { numRuns: 3000 },
    );
    // The exact change instants of 2025: 9 March 08:00Z and 2 November 07:00Z.
    for (const t of [Date.UTC(2025, 2, 9, 8) / 1000, Date.UTC(2025, 10, 2, 7) / 1000]) {
      expect(localOffset(t - 1, lt)).toBe(ianaOffset(t - 1));
      expect(localOffset(t, lt)).toBe(ianaOffset(t));
    }
  });
});

describe('bad feeds', () => {
  it('refuses malformed XML with its position', () => {
    const r = parseGreenButton(example.slice(0, 4000));
    expect(r).toMatchObject({ ok: false, reason: 'malformed-xml', message: expect.stringContaining('line') });
  });

  it('refuses a DTD, so no entity can expand', () => {
    const bomb = `<?xml version="1.0"?><!DOCTYPE feed [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]><feed xmlns="http://www.w3.org/2005/Atom"><title>&b;</title></feed>`;
    expect(parseGreenButton(bomb)).toMatchObject({ ok: false, reason: 'dtd-not-allowed' });
  });

  it('refuses XML that is not a feed, and a feed without usage', () => {
    expect(parseGreenButton('<html><body>bill</body></html>')).toMatchObject({ ok: false, reason: 'not-green-button' });
    const timeEntry = /<entry>\s*<id>urn:uuid:03481cca[\s\S]*?<\/entry>/.exec(example)?.[0] ?? '';
    const onlyTime = `${example.slice(0, example.indexOf('<!-- 1.'))}${timeEntry}</feed>`;
    expect(timeEntry).toContain('LocalTimeParameters');
    expect(parseGreenButton(onlyTime)).toMatchObject({ ok: false, reason: 'no-usage' });
    expect(parseGreenButton('')).toMatchObject({ ok: false, reason: 'empty-file' });
  });

  it('never throws on random text or mangled copies of the sample', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 300 }), fc.integer({ min: 0, max: example.length }), fc.integer({ min: 0, max: 200 }), (junk, at, cut) => {
        for (const xml of [junk, example.slice(0, at) + junk + example.slice(at + cut)]) {
          const r = parseGreenButton(xml);
          expect(r.ok === true || typeof r.message === 'string').toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });
});
