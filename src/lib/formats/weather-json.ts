/**
 * Reads daily temperatures in the JSON shape of NOAA's NCEI Access Data Service for GHCN-Daily
 * (`dataset=daily-summaries&format=json`): an array of flat objects whose values are strings,
 * e.g. `[{"DATE":"2020-12-31","STATION":"USW00023174","TMAX":"  200","TMIN":"   61"}]` without
 * `units` (tenths of °C, space-padded) or `{"TMAX":"87","TMIN":"74"}` with `units=standard`.
 * An element missing for a day is simply absent from its object. Source: NCEI "Data Service
 * API User Documentation" (parameters) and published sample responses (data-standards notes §2.2).
 *
 * Problems name the record by its 1-based position in the array (`row`) and the key (`column`).
 */
import { z } from 'zod';
import { fileFailure } from './problems';
import type { WeatherResult } from './weather-csv';
import { WeatherDayCollector, type WeatherOptions, weatherOptionsSchema } from './weather-day';

const value = z.union([z.string(), z.number(), z.null()]);
const responseSchema = z.array(z.record(z.string(), value));

const COLUMNS = { station: 'STATION', date: 'DATE', tmax: 'TMAX', tmin: 'TMIN' };

function field(record: Record<string, string | number | null>, key: string): string | number | null {
  return record[key] ?? record[key.toLowerCase()] ?? null;
}

/** The Q flag of a `TMAX_ATTRIBUTES` value ("M,Q,S,time"). */
function quality(record: Record<string, string | number | null>, key: string): string | undefined {
  const attributes = field(record, `${key}_ATTRIBUTES`);
  return typeof attributes === 'string' ? attributes.split(',')[1] : undefined;
}

/**
 * Parses a daily-summaries JSON response (text or already-parsed value).
 * @example parseWeatherJson('[{"DATE":"2024-01-01","STATION":"USW00014739","TMAX":"39","TMIN":"25"}]', { units: 'standard' })
 */
export function parseWeatherJson(input: string | unknown, options: WeatherOptions): WeatherResult {
  const parsedOptions = weatherOptionsSchema.safeParse(options);
  if (!parsedOptions.success) {
    return fileFailure('options-invalid', `The weather options are not usable: ${parsedOptions.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}.`);
  }
  let data: unknown = input;
  if (typeof input === 'string') {
    if (input.trim() === '') return fileFailure('empty-file', 'The response is empty.');
    try {
      data = JSON.parse(input);
    } catch (error) {
      return fileFailure('malformed-json', `The response is not valid JSON: ${error instanceof Error ? error.message : String(error)}.`);
    }
  }
  const parsed = responseSchema.safeParse(data);
  if (!parsed.success) {
    return fileFailure('malformed-json', 'The response is not a daily-summaries JSON array of flat records.');
  }
  const collector = new WeatherDayCollector(parsedOptions.data);
  parsed.data.forEach((record, i) => {
    if (Object.keys(record).length === 0) {
      collector.counts.emptyRows++;
      return;
    }
    collector.read(
      {
        station: String(field(record, 'STATION') ?? ''),
        date: String(field(record, 'DATE') ?? ''),
        tmax: field(record, 'TMAX'),
        tmin: field(record, 'TMIN'),
        tmaxQuality: quality(record, 'TMAX'),
        tminQuality: quality(record, 'TMIN'),
      },
      i + 1,
      COLUMNS,
    );
  });
  return { ok: true, days: collector.days, problems: collector.problems, counts: collector.counts };
}
