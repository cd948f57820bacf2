/**
 * `plumbline weather <file> --station <code> [--units standard|metric] [--json]`: loads a
 * daily-summaries CSV (STATION, DATE, TMAX, TMIN) into a station, as the Weather screen does.
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { withDatabase, parseArgs } from './db-session';

const USAGE = 'usage: plumbline weather <file> --station <code> [--units standard|metric] [--json]';

export async function weatherCommand(argv: string[], out: NodeJS.WritableStream, err: NodeJS.WritableStream = process.stderr): Promise<number> {
  const { positional, options, flags } = parseArgs(argv, ['json']);
  const file = positional[0];
  const station = options.station;
  const units = (options.units ?? 'standard') as 'standard' | 'metric';
  if (!file || !station || !['standard', 'metric', 'F', 'C'].includes(units)) {
    err.write(`${USAGE}\n`);
    return 2;
  }
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(readFileSync(file));
  } catch (e) {
    err.write(`cannot read ${file}: ${(e as Error).message}\n`);
    return 2;
  }
  return withDatabase(err, async (actor) => {
    const { importWeatherFile } = await import('../../server/weather/stations');
    const { HttpError } = await import('../../server/http');
    try {
      const report = await importWeatherFile(actor, station, { name: basename(file), bytes }, units);
      if (flags.has('json')) out.write(`${JSON.stringify(report)}\n`);
      else {
        const c = report.counts;
        out.write(`Station ${report.station}: ${c.rows} days read, ${c.new} added, ${c.changed} changed, ${c.unchanged} unchanged, ${c.rejected} refused.\n`);
        for (const p of report.problems.slice(0, 200)) out.write(`  line ${p.row}${p.column ? ` [${p.column}]` : ''} ${p.severity} ${p.code}: ${p.message}\n`);
      }
      return 0;
    } catch (e) {
      if (e instanceof HttpError) {
        err.write(`${e.message}\n`);
        return e.status >= 500 ? 1 : 2;
      }
      throw e;
    }
  });
}
