/**
 * Reads daily temperatures in the CSV shape of NOAA's NCEI Access Data Service for GHCN-Daily
 * (`dataset=daily-summaries&format=csv`): a quoted header `"STATION","DATE",...` with the
 * requested elements (`TMAX`, `TMIN`, others ignored), optional `NAME` and location columns,
 * optional `<ELEMENT>_ATTRIBUTES` columns (`M,Q,S,time` flags) with `includeAttributes=true`,
 * every field quoted, dates `YYYY-MM-DD`, missing values as empty strings, and space-padded
 * integers when no `units` was sent. Source: NCEI "Data Service API User Documentation" and
 * public client fixtures, summarized in the project's data-standards notes §2.2.
 *
 * Headers match in any case. The file goes through the same sniffing and record reader as bill
 * CSVs (encoding, not-CSV signatures, separators, line numbers: the header is line 1).
 */
import { type CsvInput, type CsvReaderOptions, CsvRecordReader, readCsvInput } from './csv-records';
import { type FileFailure, fileFailure, type RowProblem } from './problems';
import {
  type WeatherCounts,
  WeatherDayCollector,
  type WeatherDay,
  type WeatherOptions,
  weatherOptionsSchema,
} from './weather-day';

export type WeatherResult = { ok: true; days: WeatherDay[]; problems: RowProblem[]; counts: WeatherCounts } | FileFailure;

interface WeatherIndexes {
  station: number;
  date: number;
  tmax: number;
  tmin: number;
  tmaxAttributes: number;
  tminAttributes: number;
}

/** The Q (quality) flag from an `M,Q,S,time` attributes cell. */
function qualityFlag(attributes: string | undefined): string | undefined {
  if (attributes === undefined) return undefined;
  const first = attributes.indexOf(',');
  if (first < 0) return undefined;
  const second = attributes.indexOf(',', first + 1);
  return attributes.slice(first + 1, second < 0 ? undefined : second);
}

function createReader(options: WeatherOptions, csv: CsvReaderOptions): { reader: CsvRecordReader; end: () => WeatherResult } | FileFailure {
  const parsedOptions = weatherOptionsSchema.safeParse(options);
  if (!parsedOptions.success) {
    return fileFailure('options-invalid', `The weather options are not usable: ${parsedOptions.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}.`);
  }
  const collector = new WeatherDayCollector(parsedOptions.data);
  let at: WeatherIndexes | null = null;
  let names = { station: 'STATION', date: 'DATE', tmax: 'TMAX', tmin: 'TMIN' };
  const reader = new CsvRecordReader(
    {
      onHeader(cells) {
        const upper = cells.map((c) => c.trim().toUpperCase());
        const find = (name: string): number => upper.indexOf(name);
        at = {
          station: find('STATION'),
          date: find('DATE'),
          tmax: find('TMAX'),
          tmin: find('TMIN'),
          tmaxAttributes: find('TMAX_ATTRIBUTES'),
          tminAttributes: find('TMIN_ATTRIBUTES'),
        };
        const required: Array<[string, number]> = [['DATE', at.date], ['TMAX', at.tmax], ['TMIN', at.tmin]];
        if (parsedOptions.data.station === undefined) required.unshift(['STATION', at.station]);
        const missing = required.filter(([, i]) => i < 0).map(([name]) => name);
        if (missing.length === required.length) {
          return fileFailure('no-mappable-columns', 'The file has none of the columns STATION, DATE, TMAX, TMIN of the daily-summaries shape.');
        }
        if (missing.length > 0) return fileFailure('missing-columns', `The file has no ${missing.join(', ')} column.`);
        const shown = (i: number, fallback: string): string => cells[i]?.trim() || fallback;
        names = { station: shown(at.station, 'STATION'), date: shown(at.date, 'DATE'), tmax: shown(at.tmax, 'TMAX'), tmin: shown(at.tmin, 'TMIN') };
        return null;
      },
      onRecord(cells, line) {
        if (at === null) return;
        collector.read(
          {
            station: at.station < 0 ? '' : (cells[at.station] ?? ''),
            date: cells[at.date] ?? '',
            tmax: cells[at.tmax] ?? null,
            tmin: cells[at.tmin] ?? null,
            tmaxQuality: qualityFlag(at.tmaxAttributes < 0 ? undefined : cells[at.tmaxAttributes]),
            tminQuality: qualityFlag(at.tminAttributes < 0 ? undefined : cells[at.tminAttributes]),
          },
          line,
          names,
        );
      },
      onEmpty() {
        collector.counts.emptyRows++;
      },
      onSyntaxError(line, message) {
        collector.counts.records++;
        collector.counts.rejected++;
        collector.problems.push({ row: line, column: null, code: 'csv-syntax', message, severity: 'error' });
      },
    },
    csv,
  );
  return {
    reader,
    end: () => {
      const read = reader.end();
      if (!read.ok) return read;
      return { ok: true, days: collector.days, problems: collector.problems, counts: collector.counts };
    },
  };
}

/**
 * Parses a daily-summaries CSV held in a string.
 * @example parseWeatherCsvText('"STATION","DATE","TMAX","TMIN"\n"USW00014739","2024-01-01","39","25"\n', { units: 'standard' })
 *   // { ok: true, days: [{ station: 'USW00014739', date: '2024-01-01', tmaxF: 39, tminF: 25 }], ... }
 */
export function parseWeatherCsvText(text: string, options: WeatherOptions, csv: CsvReaderOptions = {}): WeatherResult {
  const created = createReader(options, csv);
  if ('ok' in created) return created;
  return created.reader.push(text) ?? created.end();
}

/** Parses a daily-summaries CSV from a string, bytes or an async iterable of chunks. */
export async function parseWeatherCsv(input: CsvInput, options: WeatherOptions, csv: CsvReaderOptions = {}): Promise<WeatherResult> {
  const created = createReader(options, csv);
  if ('ok' in created) return created;
  return (await readCsvInput(input, created.reader)) ?? created.end();
}
