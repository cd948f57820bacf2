/**
 * Validation of one daily weather record (station, date, Tmax, Tmin) as delivered by NOAA's
 * NCEI Access Data Service for GHCN-Daily (`dataset=daily-summaries`), shared by the CSV and
 * JSON readers. Temperatures are converted to °F from the units the caller states:
 * - `standard` or `F`: °F as delivered with `units=standard`;
 * - `metric` or `C`: °C as delivered with `units=metric`;
 * - `tenths-C`: the stored GHCN values (tenths of °C), delivered when `units` is omitted
 *   (GHCN-Daily readme §III: TMAX/TMIN in tenths of degrees C).
 * °F = °C × 9/5 + 32 (exact by definition; NIST SP 811 §B.9); results are rounded to 0.0001 °F
 * to drop binary noise (tenths of °C give at most two decimals in °F, so nothing is lost).
 *
 * Checks: a blank value is missing (kept as null, never an error); Tmin above Tmax, values beyond
 * the world records and repeated station-dates are errors; values at or beyond the US national
 * records are warnings; a value whose GHCN quality flag is set (the Q field of
 * `<ELEMENT>_ATTRIBUTES`) failed NCEI's checks and is dropped to null with a warning (GHCN-Daily
 * readme §III: a blank QFLAG means the value passed all checks).
 */
import { z } from 'zod';
import { DEFAULT_TWO_DIGIT_YEAR_PIVOT, parseDateCell } from './cell-date';
import { parseNumberCell } from './cell-number';
import { quoteValue, type RowProblem, type RowProblemCode, type Severity } from './problems';

export const weatherUnitsSchema = z.enum(['standard', 'metric', 'F', 'C', 'tenths-C']);
export type WeatherUnits = z.infer<typeof weatherUnitsSchema>;

export const weatherOptionsSchema = z.object({
  units: weatherUnitsSchema,
  /** The station the file is for: fills a blank STATION and refuses rows of other stations. */
  station: z.string().trim().min(1).optional(),
  /** Two-digit years below this are 20yy (POSIX %y rule). */
  twoDigitYearPivot: z.number().int().min(0).max(100).optional(),
});
export type WeatherOptions = z.input<typeof weatherOptionsSchema>;

export interface WeatherDay {
  station: string;
  date: string;
  tmaxF: number | null;
  tminF: number | null;
}

export interface WeatherCounts {
  records: number;
  valid: number;
  rejected: number;
  emptyRows: number;
  missingValues: number;
}

// World records (WMO World Weather and Climate Extremes Archive) [memory]: highest 56.7 °C =
// 134.1 °F (Furnace Creek, 10 July 1913), lowest −89.2 °C = −128.6 °F (Vostok, 21 July 1983).
export const WORLD_RECORD_HIGH_F = 134.1;
export const WORLD_RECORD_LOW_F = -128.6;
// US national records (NOAA NCEI State Climate Extremes Committee) [memory]: 134 °F (Death
// Valley, 1913) and −80 °F (Prospect Creek, Alaska, 23 January 1971).
export const US_RECORD_HIGH_F = 134;
export const US_RECORD_LOW_F = -80;

export interface RawWeatherDay {
  station: string;
  date: string;
  tmax: string | number | null;
  tmin: string | number | null;
  tmaxQuality?: string | undefined;
  tminQuality?: string | undefined;
}

export interface WeatherColumns {
  station: string;
  date: string;
  tmax: string;
  tmin: string;
}

function toFahrenheit(value: number, units: WeatherUnits): number {
  const f = units === 'standard' || units === 'F' ? value : units === 'tenths-C' ? (value / 10) * 1.8 + 32 : value * 1.8 + 32;
  const rounded = Math.round(f * 1e4) / 1e4;
  return rounded === 0 ? 0 : rounded;
}

/** Collects valid days and problems; remembers station-dates to find repeats. */
export class WeatherDayCollector {
  readonly days: WeatherDay[] = [];
  readonly problems: RowProblem[] = [];
  readonly counts: WeatherCounts = { records: 0, valid: 0, rejected: 0, emptyRows: 0, missingValues: 0 };
  private readonly seen = new Map<string, number>();
  private readonly pivot: number;

  constructor(private readonly options: z.output<typeof weatherOptionsSchema>) {
    this.pivot = options.twoDigitYearPivot ?? DEFAULT_TWO_DIGIT_YEAR_PIVOT;
  }

  private add(row: number, column: string, code: RowProblemCode, message: string, severity: Severity = 'error'): void {
    this.problems.push({ row, column, code, message, severity });
  }

  private temperature(raw: string | number | null, quality: string | undefined, row: number, column: string, label: string): number | null | 'error' {
    const text = raw === null ? '' : String(raw).trim();
    if (text === '') {
      this.counts.missingValues++;
      return null;
    }
    const parsed = parseNumberCell(text, 'point');
    if (!parsed.ok) {
      this.add(row, column, 'bad-number', `${label} ${quoteValue(text)} ${parsed.why}.`);
      return 'error';
    }
    if (quality !== undefined && quality.trim() !== '') {
      this.add(row, column, 'qc-flagged', `${label} ${quoteValue(text)} failed NCEI quality check "${quality.trim()}" and is treated as missing.`, 'warning');
      this.counts.missingValues++;
      return null;
    }
    const f = toFahrenheit(parsed.value, this.options.units);
    if (f > WORLD_RECORD_HIGH_F || f < WORLD_RECORD_LOW_F) {
      this.add(row, column, 'temperature-out-of-range', `${label} ${quoteValue(text)} is ${f} °F, beyond the world record (${WORLD_RECORD_LOW_F} to ${WORLD_RECORD_HIGH_F} °F); check the units.`);
      return 'error';
    }
    if (f >= US_RECORD_HIGH_F || f <= US_RECORD_LOW_F) {
      this.add(row, column, 'temperature-suspect', `${label} ${quoteValue(text)} is ${f} °F, at or beyond the US record (${US_RECORD_LOW_F} to ${US_RECORD_HIGH_F} °F); check the reading.`, 'warning');
    }
    return f;
  }

  /** Validates one record; `row` is its file line (CSV) or 1-based position (JSON). */
  read(day: RawWeatherDay, row: number, columns: WeatherColumns): void {
    this.counts.records++;
    const before = this.problems.length;
    let station = day.station.trim();
    if (station === '' && this.options.station !== undefined) station = this.options.station;
    if (station === '') this.add(row, columns.station, 'missing-value', 'Station is blank.');
    else if (this.options.station !== undefined && station !== this.options.station) {
      this.add(row, columns.station, 'other-station', `Station ${quoteValue(station)} is not the station being loaded (${this.options.station}).`);
    }
    let date = '';
    const dateRaw = day.date.trim();
    if (dateRaw === '') this.add(row, columns.date, 'missing-value', 'Date is blank.');
    else {
      const parsed = parseDateCell(dateRaw, this.pivot);
      if (parsed.ok) date = parsed.iso;
      else {
        const why = parsed.code === 'bad-date' ? `is not a date this import can read; ${parsed.why}` : `is not a real date: ${parsed.why}`;
        this.add(row, columns.date, parsed.code, `Date ${quoteValue(dateRaw)} ${why}.`);
      }
    }
    if (station !== '' && date !== '') {
      const key = `${station}|${date}`;
      const first = this.seen.get(key);
      if (first !== undefined) this.add(row, columns.date, 'duplicate-date', `Date ${date} for station ${station} already appears on row ${first}.`);
      else this.seen.set(key, row);
    }
    const tmax = this.temperature(day.tmax, day.tmaxQuality, row, columns.tmax, 'Tmax');
    const tmin = this.temperature(day.tmin, day.tminQuality, row, columns.tmin, 'Tmin');
    if (typeof tmax === 'number' && typeof tmin === 'number' && tmin > tmax) {
      this.add(row, columns.tmin, 'tmin-above-tmax', `Tmin ${tmin} °F is above Tmax ${tmax} °F.`);
    }
    if (this.problems.slice(before).some((p) => p.severity === 'error') || tmax === 'error' || tmin === 'error') {
      this.counts.rejected++;
      return;
    }
    this.counts.valid++;
    this.days.push({ station, date, tmaxF: tmax, tminF: tmin });
  }
}
