/**
 * Turns a Green Button "Download My Data" feed (NAESB REQ.21 ESPI) into bill periods per usage
 * point: quantity in kWh, therms, ccf, m³, gallons or MMBtu after the power-of-ten multiplier,
 * cost in currency units (dollars for USD), inclusive local dates.
 *
 * Method (espi.xsd 4.0.20231213 annotations; project notes data-standards §1.3):
 * - quantity of a reading = value × 10^powerOfTenMultiplier in the ReadingType's `uom`;
 *   Wh -> kWh divides by 1000. Values are integers, so they are summed exactly and scaled once;
 * - cost and billLastPeriod are in hundred-thousandths of the currency (4886288 -> 48.86288);
 * - only use within each interval is summed: accumulationBehaviour 4 (deltaData) or absent;
 *   register readings, demand (W) and received energy (flowDirection 19) are left out with a note;
 * - bill periods: a usage point's UsageSummary billingPeriods when it has them (quantity from
 *   overallConsumptionLastPeriod, else the readings inside the period; cost from billLastPeriod,
 *   else the readings' costs); otherwise the readings summed per local calendar month of their
 *   start, a reading of 25 days or more being a bill period of its own;
 * - dates: an instant's local date uses the usage point's LocalTimeParameters (tzOffset plus the
 *   DST rules, see green-button-time.ts), or the feed's only one, else UTC with a note. A period
 *   [start, start + duration) runs from the local date of start to the local date of its last
 *   second, both inclusive;
 * - a period is estimated when a reading in it has ReadingQuality 8 or 9 (estimated) or the
 *   summary's qualityOfReading says so.
 */
import type { Commodity, Unit } from '../domain';
import type { NormalizedBillRow } from './bill-csv-row';
import { civilFromDay, isoFromDays } from './calendar';
import { child, children, type EspiEntry, integer, linkedEntries, readEspiFeed, type XmlNode } from './green-button-feed';
import { type EspiLocalTime, localDay, readLocalTime } from './green-button-time';
import { DEFAULT_MAX_BYTES } from './csv-records';
import { type FileFailure, fileFailure } from './problems';

export interface GreenButtonPeriod {
  periodStart: string;
  periodEnd: string;
  quantity: number;
  unit: Unit;
  /** In currency units (dollars for USD); undefined when the feed states no cost. */
  cost: number | undefined;
  estimated: boolean;
  /** Interval readings summed into the period (0 when the quantity came from a summary). */
  readings: number;
}

export interface GreenButtonSeries {
  usagePoint: { href: string | null; title: string; serviceKind: number };
  commodity: Commodity;
  source: 'usage-summary' | 'intervals';
  readingTypeHref: string | null;
  unit: Unit;
  /** ISO 4217 numeric currency code (840 = USD), when stated. */
  currency: number | null;
  timeZone: { tzOffsetSeconds: number; dst: boolean } | null;
  periods: GreenButtonPeriod[];
}

export interface GreenButtonNote {
  code: string;
  message: string;
}

export type GreenButtonResult = { ok: true; series: GreenButtonSeries[]; notes: GreenButtonNote[] } | FileFailure;

// UnitSymbolKind (espi.xsd 4.0): 72 Wh, 169 therm, 119 ft³, 42 m³, 128 US gallon, 132 Btu.
const QUANTITY_UOM: ReadonlyMap<number, { unit: Unit; exponent: number }> = new Map([
  [72, { unit: 'kWh', exponent: -3 }],
  [169, { unit: 'therm', exponent: 0 }],
  [119, { unit: 'ccf', exponent: -2 }],
  [42, { unit: 'm3', exponent: 0 }],
  [128, { unit: 'gal', exponent: 0 }],
  [132, { unit: 'MMBtu', exponent: -6 }],
]);
// ServiceKind (espi.xsd 4.0): 0 electricity, 1 gas, 2 water.
const SERVICE_KINDS: ReadonlyMap<number, Commodity> = new Map([
  [0, 'electricity'],
  [1, 'natural_gas'],
  [2, 'water'],
]);
// QualityOfReading (espi.xsd 4.0): 8 estimated using reference day, 9 estimated using linear interpolation.
const ESTIMATED_QUALITIES = new Set([8, 9]);
// Money is in hundred-thousandths of the currency (espi.xsd 4.0, IntervalReading/cost, billLastPeriod).
const MONEY_DIVISOR = 100_000;
// A reading this long is a bill period itself (monthly bills run 25-35 days: CalTRACK 2.0 §2.2.3.4).
const BILLING_READING_SECONDS = 25 * 86_400;
// MeasurementKind (espi.xsd 4.0): 8 demand, 37 power; UnitSymbolKind 38 W.
const DEMAND_KINDS = new Set([8, 37]);

interface Reading {
  start: number;
  duration: number;
  value: number;
  cost: number | null;
  estimated: boolean;
}

interface ReadingSeries {
  readingTypeHref: string | null;
  unit: Unit;
  exponent: number;
  currency: number | null;
  readings: Reading[];
}

/** value × 10^exponent with one rounding (powers of ten up to 10^22 are exact doubles). */
function scaled(sum: number, exponent: number): number {
  return exponent >= 0 ? sum * 10 ** exponent : sum / 10 ** -exponent;
}

function readingsOf(meterReading: EspiEntry, entries: readonly EspiEntry[], intervalLength: number | null, notes: GreenButtonNote[]): Reading[] {
  const readings: Reading[] = [];
  let unreadable = 0;
  for (const blockEntry of linkedEntries(meterReading, entries, 'IntervalBlock')) {
    for (const block of blockEntry.resources) {
      const interval = child(block, 'interval');
      const rows = children(block, 'IntervalReading');
      const blockStart = integer(interval, 'start');
      const step = intervalLength ?? (rows.length > 0 ? Math.floor((integer(interval, 'duration') ?? 0) / rows.length) : 0);
      rows.forEach((r, k) => {
        const period = child(r, 'timePeriod');
        const start = integer(period, 'start') ?? (blockStart === null ? null : blockStart + k * step);
        const value = integer(r, 'value');
        if (start === null || value === null) {
          unreadable++;
          return;
        }
        const quality = children(r, 'ReadingQuality').map((q) => integer(q, 'quality'));
        readings.push({
          start,
          duration: integer(period, 'duration') ?? step,
          value,
          cost: integer(r, 'cost'),
          estimated: quality.some((q) => q !== null && ESTIMATED_QUALITIES.has(q)),
        });
      });
    }
  }
  if (unreadable > 0) {
    notes.push({ code: 'unreadable-readings', message: `${unreadable} interval readings without a time or an integer value were left out.` });
  }
  return readings.sort((a, b) => a.start - b.start);
}

function seriesOf(meterReading: EspiEntry, entries: readonly EspiEntry[], label: string, notes: GreenButtonNote[]): ReadingSeries | null {
  const readingType = linkedEntries(meterReading, entries, 'ReadingType')[0];
  if (readingType === undefined) {
    notes.push({ code: 'no-reading-type', message: `${label}: a meter reading has no ReadingType and was left out.` });
    return null;
  }
  const rt = readingType.resource;
  const uom = integer(rt, 'uom');
  const kind = integer(rt, 'kind');
  const accumulation = integer(rt, 'accumulationBehaviour');
  if (uom === 38 || (kind !== null && DEMAND_KINDS.has(kind))) {
    notes.push({ code: 'demand-skipped', message: `${label}: demand (power) readings are not bill quantities and were left out.` });
    return null;
  }
  const unit = uom === null ? undefined : QUANTITY_UOM.get(uom);
  if (unit === undefined) {
    notes.push({ code: 'unsupported-unit', message: `${label}: readings in unit code ${uom ?? 'none'} are not supported and were left out.` });
    return null;
  }
  if (accumulation !== null && accumulation !== 0 && accumulation !== 4) {
    notes.push({ code: 'not-interval-use', message: `${label}: readings with accumulationBehaviour ${accumulation} are meter registers, not use per interval, and were left out.` });
    return null;
  }
  if (integer(rt, 'flowDirection') === 19) {
    notes.push({ code: 'export-skipped', message: `${label}: energy received from the customer (flowDirection 19) was left out.` });
    return null;
  }
  return {
    readingTypeHref: readingType.self,
    unit: unit.unit,
    exponent: (integer(rt, 'powerOfTenMultiplier') ?? 0) + unit.exponent,
    currency: integer(rt, 'currency'),
    readings: readingsOf(meterReading, entries, integer(rt, 'intervalLength'), notes),
  };
}

function periodFrom(readings: readonly Reading[], series: ReadingSeries, lt: EspiLocalTime | null): GreenButtonPeriod {
  let sum = 0;
  let cost = 0;
  let costed = false;
  let estimated = false;
  let first = Number.POSITIVE_INFINITY;
  let last = Number.NEGATIVE_INFINITY;
  for (const r of readings) {
    sum += r.value;
    if (r.cost !== null) {
      cost += r.cost;
      costed = true;
    }
    estimated ||= r.estimated;
    first = Math.min(first, localDay(r.start, lt));
    last = Math.max(last, localDay(r.start + Math.max(r.duration, 1) - 1, lt));
  }
  return {
    periodStart: isoFromDays(first),
    periodEnd: isoFromDays(last),
    quantity: scaled(sum, series.exponent),
    unit: series.unit,
    cost: costed ? cost / MONEY_DIVISOR : undefined,
    estimated,
    readings: readings.length,
  };
}

/** Readings summed per local calendar month of their start; a billing-length reading stands alone. */
function monthlyPeriods(series: ReadingSeries, lt: EspiLocalTime | null): GreenButtonPeriod[] {
  const groups = new Map<string, Reading[]>();
  for (const r of series.readings) {
    const c = civilFromDay(localDay(r.start, lt));
    const key = r.duration >= BILLING_READING_SECONDS ? `r${r.start}` : `m${c.year * 12 + c.month}`;
    const list = groups.get(key);
    if (list === undefined) groups.set(key, [r]);
    else list.push(r);
  }
  return [...groups.values()].map((g) => periodFrom(g, series, lt)).sort((a, b) => a.periodStart.localeCompare(b.periodStart));
}

function summaryPeriods(summaries: readonly EspiEntry[], series: ReadingSeries | null, lt: EspiLocalTime | null, label: string, notes: GreenButtonNote[]): GreenButtonPeriod[] {
  const periods: GreenButtonPeriod[] = [];
  for (const s of summaries.flatMap((e) => e.resources)) {
    const billing = child(s, 'billingPeriod');
    const start = integer(billing, 'start');
    const duration = integer(billing, 'duration');
    if (start === null || duration === null || duration <= 0) {
      notes.push({ code: 'summary-without-period', message: `${label}: a usage summary without a billing period was left out.` });
      continue;
    }
    const inside = series === null ? [] : series.readings.filter((r) => r.start >= start && r.start < start + duration);
    const fromReadings = series === null || inside.length === 0 ? null : periodFrom(inside, series, lt);
    const consumption: XmlNode | null = child(s, 'overallConsumptionLastPeriod');
    const uom = integer(consumption, 'uom');
    const unit = uom === null ? undefined : QUANTITY_UOM.get(uom);
    const value = integer(consumption, 'value');
    let quantity: number;
    let periodUnit: Unit;
    if (unit !== undefined && value !== null) {
      quantity = scaled(value, (integer(consumption, 'powerOfTenMultiplier') ?? 0) + unit.exponent);
      periodUnit = unit.unit;
    } else if (fromReadings !== null) {
      quantity = fromReadings.quantity;
      periodUnit = fromReadings.unit;
    } else {
      notes.push({ code: 'summary-without-quantity', message: `${label}: a usage summary with no readable consumption was left out.` });
      continue;
    }
    const bill = integer(s, 'billLastPeriod');
    const quality = integer(s, 'qualityOfReading');
    periods.push({
      periodStart: isoFromDays(localDay(start, lt)),
      periodEnd: isoFromDays(localDay(start + duration - 1, lt)),
      quantity,
      unit: periodUnit,
      cost: bill !== null ? bill / MONEY_DIVISOR : fromReadings?.cost,
      estimated: (quality !== null && ESTIMATED_QUALITIES.has(quality)) || (fromReadings?.estimated ?? false),
      readings: unit !== undefined && value !== null ? 0 : inside.length,
    });
  }
  return periods.sort((a, b) => a.periodStart.localeCompare(b.periodStart));
}

function localTimeFor(usagePoint: EspiEntry, entries: readonly EspiEntry[]): EspiLocalTime | null {
  const linked = linkedEntries(usagePoint, entries, 'LocalTimeParameters');
  const all = entries.filter((e) => e.kind === 'LocalTimeParameters');
  const chosen = linked[0] ?? (all.length === 1 ? all[0] : undefined);
  return chosen === undefined ? null : readLocalTime(chosen.resource);
}

/**
 * Parses a Green Button feed into bill periods per usage point.
 * @example parseGreenButton(xml) // { ok: true, series: [{ commodity: 'electricity', periods: [...] }], notes: [] }
 */
export function parseGreenButton(xml: string, options: { maxBytes?: number } = {}): GreenButtonResult {
  if (xml.length > (options.maxBytes ?? DEFAULT_MAX_BYTES)) return fileFailure('too-large', 'The file is larger than the upload limit.');
  const feed = readEspiFeed(xml);
  if (!feed.ok) return feed;
  const { entries } = feed;
  const notes: GreenButtonNote[] = [];
  const result: GreenButtonSeries[] = [];
  const usagePoints = entries.filter((e) => e.kind === 'UsagePoint');
  for (const up of usagePoints) {
    const label = up.title === '' ? (up.self ?? 'usage point') : up.title;
    const serviceKind = integer(child(up.resource, 'ServiceCategory'), 'kind') ?? -1;
    const commodity = SERVICE_KINDS.get(serviceKind);
    if (commodity === undefined) {
      notes.push({ code: 'unsupported-service', message: `${label}: service kind ${serviceKind} is not electricity, gas or water and was left out.` });
      continue;
    }
    const lt = localTimeFor(up, entries);
    if (lt === null) notes.push({ code: 'no-local-time', message: `${label}: no LocalTimeParameters, so dates are in UTC.` });
    const series = linkedEntries(up, entries, 'MeterReading')
      .map((mr) => seriesOf(mr, entries, label, notes))
      .filter((s): s is ReadingSeries => s !== null);
    const summaries = [...linkedEntries(up, entries, 'UsageSummary'), ...linkedEntries(up, entries, 'ElectricPowerUsageSummary')];
    const base = {
      usagePoint: { href: up.self, title: up.title, serviceKind },
      commodity,
      timeZone: lt === null ? null : { tzOffsetSeconds: lt.tzOffset, dst: lt.dstStart !== null },
    };
    if (summaries.length > 0) {
      const periods = summaryPeriods(summaries, series[0] ?? null, lt, label, notes);
      const first = periods[0];
      if (first !== undefined) {
        const currency = summaries.map((e) => integer(e.resource, 'currency')).find((c) => c !== null) ?? series[0]?.currency ?? null;
        result.push({ ...base, source: 'usage-summary', readingTypeHref: series[0]?.readingTypeHref ?? null, unit: first.unit, currency, periods });
      }
      continue;
    }
    for (const s of series) {
      if (s.readings.length === 0) continue;
      result.push({ ...base, source: 'intervals', readingTypeHref: s.readingTypeHref, unit: s.unit, currency: s.currency, periods: monthlyPeriods(s, lt) });
    }
  }
  if (result.length === 0) {
    const why = notes.length > 0 ? ` ${notes.map((n) => n.message).join(' ')}` : '';
    return fileFailure('no-usage', `The feed holds no usage that can be imported: no usage point with interval readings or bill summaries.${why}`);
  }
  return { ok: true, series: result, notes };
}

/** The periods of one series as bill rows for a meter (Green Button states no peak demand here). */
export function greenButtonBillRows(series: GreenButtonSeries, meterCode: string): NormalizedBillRow[] {
  return series.periods.map((p) => ({
    meterCode,
    periodStart: p.periodStart,
    periodEnd: p.periodEnd,
    quantity: p.quantity,
    unit: p.unit,
    cost: p.cost,
    demandKw: undefined,
    estimated: p.estimated,
  }));
}
