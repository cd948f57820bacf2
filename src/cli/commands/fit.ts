/**
 * `plumbline fit --bills <csv> --weather <csv> [--json] [--workers N] [--shapes a,b,...]`
 *
 * Fits a weather-normalized baseline to every series of a bills file, without the database.
 * Bills CSV: `series,period_start,period_end,quantity` (ISO dates, both inclusive).
 * Weather CSV: `DATE,TMAX,TMIN` in °F (one station; other columns ignored; empty = missing).
 * NAC uses the normal year of the weather file's complete calendar years. `--shapes` restricts the
 * model shapes for every series (e.g. `mean,heating,linear` for a heating fuel); default all.
 * Exit codes: 0 done (series that cannot be fitted carry a reason), 2 usage or input error.
 */
import { readFile } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import Papa from 'papaparse';
import { z } from 'zod';
import { isoDateToDay } from '../../lib/baseline/calendar-days';
import { dailyTemperaturesFromRows, type DailyTemperatureRow } from '../../lib/baseline/daily-temperatures';
import { BaselineEngine, fitOptionsSchema } from '../../lib/baseline/engine';
import { SHAPES, shapeSchema, type Shape } from '../../lib/baseline/grid';
import { normalYearFromTable, normalYearTable } from '../../lib/baseline/normal-year';
import { summarizeFit, type SeriesSummary } from '../../lib/baseline/series-summary';
import { FitPool, type PoolSeries } from '../../server/fit-pool';

const USAGE = 'usage: plumbline fit --bills <bills.csv> --weather <weather.csv> [--json] [--workers N] [--shapes mean,heating,...]';
/** Below this many series a pool costs more to start than it saves. */
const POOL_THRESHOLD = 200;

class InputError extends Error {}

interface Args {
  bills: string;
  weather: string;
  json: boolean;
  workers: number | null;
  shapes: Shape[] | null;
}

function parseArgs(argv: string[]): Args {
  let bills: string | null = null;
  let weather: string | null = null;
  let json = false;
  let workers: number | null = null;
  let shapes: Shape[] | null = null;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const value = (): string => {
      const v = argv[++i];
      if (v === undefined || v.startsWith('--')) throw new InputError(`${a} needs a value\n${USAGE}`);
      return v;
    };
    if (a === '--bills') bills = value();
    else if (a === '--weather') weather = value();
    else if (a === '--json') json = true;
    else if (a === '--workers') {
      const v = value();
      workers = Number(v);
      if (!Number.isInteger(workers) || workers < 0) throw new InputError(`--workers must be a whole number ≥ 0, got '${v}'`);
    } else if (a === '--shapes') {
      const v = value();
      const parsed = z.array(shapeSchema).min(1).safeParse(v.split(',').map((x) => x.trim()));
      if (!parsed.success) throw new InputError(`--shapes takes a comma list of ${SHAPES.join(', ')}; got '${v}'`);
      shapes = parsed.data;
    } else throw new InputError(`unknown argument '${a}'\n${USAGE}`);
  }
  if (bills === null || weather === null) throw new InputError(`--bills and --weather are required\n${USAGE}`);
  return { bills, weather, json, workers, shapes };
}

/**
 * Stream the rows of a CSV file (papaparse, chunked so 720,000 bill rows do not become 720,000
 * retained objects) after checking that the header names every required column
 * (case-insensitive). `onRow` gets the cells of the required columns, in `required` order, and
 * the row's line number.
 */
async function readCsv(path: string, what: string, required: string[], onRow: (cells: string[], line: number) => void): Promise<void> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? 'error';
    throw new InputError(`cannot read the ${what} file '${path}' (${code})`);
  }
  let columns: number[] | null = null;
  let line = 0;
  let failure: InputError | null = null;
  // papaparse runs `chunk` synchronously for string input too; its typings only list it for files
  const config: Papa.ParseConfig<string[]> & { chunkSize: number; chunk: (res: Papa.ParseResult<string[]>, parser: Papa.Parser) => void } = {
    header: false,
    skipEmptyLines: 'greedy',
    chunkSize: 1 << 20,
    chunk: (res, parser) => {
      for (const row of res.data) {
        line++;
        if (columns === null) {
          const fields = row.map((f) => f.trim());
          const found = required.map((name) => fields.findIndex((f) => f.toLowerCase() === name.toLowerCase()));
          const missing = required.find((_, j) => found[j] === -1);
          if (missing !== undefined) {
            failure = new InputError(`the ${what} file '${path}' has no '${missing}' column (it needs ${required.join(', ')}; found: ${fields.join(', ') || 'none'})`);
            parser.abort();
            return;
          }
          columns = found;
          continue;
        }
        onRow(columns.map((c) => row[c] ?? ''), line);
      }
    },
  };
  Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), config);
  if (failure !== null) throw failure;
  if (columns === null) throw new InputError(`the ${what} file '${path}' is empty`);
}

function reportRowErrors(errors: string[], what: string): void {
  if (errors.length === 0) return;
  const shown = errors.slice(0, 10).join('\n  ');
  throw new InputError(`${errors.length} invalid row(s) in the ${what} file:\n  ${shown}${errors.length > 10 ? '\n  …' : ''}`);
}

async function readBills(path: string): Promise<PoolSeries[]> {
  const bySeries = new Map<string, { starts: number[]; ends: number[]; quantities: number[] }>();
  const errors: string[] = [];
  await readCsv(path, 'bills', ['series', 'period_start', 'period_end', 'quantity'], ([rawId, rawStart, rawEnd, rawQ], line) => {
    const id = rawId!.trim();
    const start = isoDateToDay(rawStart!);
    const end = isoDateToDay(rawEnd!);
    const q = rawQ!.trim() === '' ? Number.NaN : Number(rawQ);
    if (id === '') errors.push(`line ${line}: empty series`);
    else if (start === null) errors.push(`line ${line}: period_start '${rawStart}' is not a date YYYY-MM-DD`);
    else if (end === null) errors.push(`line ${line}: period_end '${rawEnd}' is not a date YYYY-MM-DD`);
    else if (end < start) errors.push(`line ${line}: period_end is before period_start`);
    else if (!Number.isFinite(q)) errors.push(`line ${line}: quantity '${rawQ!.trim()}' is not a number`);
    else {
      let s = bySeries.get(id);
      if (s === undefined) bySeries.set(id, (s = { starts: [], ends: [], quantities: [] }));
      s.starts.push(start);
      s.ends.push(end);
      s.quantities.push(q);
    }
  });
  reportRowErrors(errors, 'bills');
  return [...bySeries].map(([id, s]) => ({ id, stationId: 'weather', startDay: s.starts, endDay: s.ends, quantity: s.quantities }));
}

async function readWeather(path: string): Promise<DailyTemperatureRow[]> {
  const errors: string[] = [];
  const out: DailyTemperatureRow[] = [];
  const num = (raw: string, line: number, name: string): number | null => {
    const t = raw.trim();
    if (t === '') return null;
    const v = Number(t);
    if (!Number.isFinite(v)) errors.push(`line ${line}: ${name} '${t}' is not a number`);
    return Number.isFinite(v) ? v : null;
  };
  await readCsv(path, 'weather', ['DATE', 'TMAX', 'TMIN'], ([rawDate, tmax, tmin], line) => {
    const date = rawDate!.trim();
    if (isoDateToDay(date) === null) errors.push(`line ${line}: DATE '${date}' is not a date YYYY-MM-DD`);
    else out.push({ date, tmaxF: num(tmax!, line, 'TMAX'), tminF: num(tmin!, line, 'TMIN') });
  });
  reportRowErrors(errors, 'weather');
  if (out.length === 0) throw new InputError(`the weather file '${path}' has no rows`);
  return out;
}

function cell(v: number | null, digits: number): string {
  return v === null ? '—' : v.toFixed(digits);
}

function writeTable(out: NodeJS.WritableStream, summaries: SeriesSummary[]): void {
  const head = ['series', 'result', 'shape', 'τH °F', 'τC °F', 'R²', 'adj R²', 'CV(RMSE)', 'NAC/yr'];
  const rows = summaries.map((s) => {
    const m = s.selected;
    if (!s.ok || m === null) return [s.id, s.reason ?? 'failed', '', '', '', '', '', '', ''];
    return [s.id, s.status ?? 'ok', m.shape, cell(m.heatingBalanceF, 0), cell(m.coolingBalanceF, 0), cell(m.r2, 3), cell(m.adjR2, 3), m.cvrmse === null ? '—' : `${(m.cvrmse * 100).toFixed(1)} %`, cell(s.nac, 0)];
  });
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j]!.length)));
  const line = (r: string[]): string => r.map((c, j) => (j < 3 ? c.padEnd(widths[j]!) : c.padStart(widths[j]!))).join('  ');
  out.write(`${line(head)}\n${widths.map((w) => '─'.repeat(w)).join('  ')}\n`);
  for (const r of rows) out.write(`${line(r)}\n`);
}

function writeJson(out: NodeJS.WritableStream, summaries: SeriesSummary[]): void {
  out.write('{ "series": [\n');
  const batch: string[] = [];
  summaries.forEach((s, i) => {
    const item = s.ok ? { id: s.id, ok: true, selected: s.selected, nac: s.nac } : { id: s.id, ok: false, reason: s.reason, selected: null, nac: null };
    batch.push(`  ${JSON.stringify(item)}${i < summaries.length - 1 ? ',' : ''}`);
    if (batch.length === 1000) out.write(`${batch.splice(0).join('\n')}\n`);
  });
  if (batch.length > 0) out.write(`${batch.join('\n')}\n`);
  out.write('] }\n');
}

async function fitAll(series: PoolSeries[], weatherRows: DailyTemperatureRow[], workers: number | null, shapes: Shape[] | null): Promise<SeriesSummary[]> {
  const temps = dailyTemperaturesFromRows(weatherRows);
  if (temps === null) throw new InputError('the weather file has no usable dates');
  const usePool = workers === null ? series.length >= POOL_THRESHOLD : workers > 0;
  const fit = { statistics: 'selected', includePeriods: false, ...(shapes === null ? {} : { shapes }) } as const;
  if (!usePool) {
    const engine = new BaselineEngine();
    const options = fitOptionsSchema.parse(fit);
    const table = normalYearTable(temps);
    const normal = table === null ? null : normalYearFromTable(table);
    return series.map((s) => {
      const result = engine.fit(s, temps, options);
      return summarizeFit(s.id, result, result.ok ? normal : null);
    });
  }
  const pool = FitPool.create({ workers: workers ?? availableParallelism() });
  try {
    await pool.setStation({ id: 'weather', firstDay: temps.firstDay, meanF: temps.meanF });
    const out = new Array<SeriesSummary>(series.length);
    for await (const r of pool.fitMany(series, { fit, normalYear: true })) out[r.index] = r.summary;
    return out;
  } finally {
    await pool.close();
  }
}

/**
 * Run the fit command; returns the process exit code.
 * @param err where error messages go (default: stderr)
 */
export async function fitCommand(argv: string[], out: NodeJS.WritableStream, err: NodeJS.WritableStream = process.stderr): Promise<number> {
  try {
    const args = parseArgs(argv);
    const [series, weather] = await Promise.all([readBills(args.bills), readWeather(args.weather)]);
    const summaries = await fitAll(series, weather, args.workers, args.shapes);
    if (args.json) writeJson(out, summaries);
    else writeTable(out, summaries);
    return 0;
  } catch (e) {
    if (e instanceof InputError) {
      err.write(`fit: ${e.message}\n`);
      return 2;
    }
    throw e;
  }
}
