/**
 * Test support: read fixture CSV/JSON files and build synthetic series whose period degree days
 * are exact (constant temperature within each period, so HDD_p(b) = max(0, b − T)).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { packDailyMeans, type DailyTemperatures } from '../../../src/lib/baseline/daily-temperatures';
import type { BillArrays } from '../../../src/lib/baseline/bill-periods';

export function fixturePath(rel: string): string {
  return fileURLToPath(new URL(`../../fixtures/${rel}`, import.meta.url));
}

/** Rows of a fixture CSV (lines starting with # skipped), as objects of numbers keyed by header. */
export function readCsvNumbers(rel: string): Record<string, number>[] {
  const lines = readFileSync(fixturePath(rel), 'utf8').split(/\r?\n/).filter((l) => l.trim() !== '' && !l.startsWith('#'));
  const header = lines[0]!.split(',');
  return lines.slice(1).map((l) => {
    const cells = l.split(',');
    return Object.fromEntries(header.map((h, i) => [h, Number(cells[i])]));
  });
}

export function readJson<T>(rel: string): T {
  return JSON.parse(readFileSync(fixturePath(rel), 'utf8')) as T;
}

/** Relative error |a − b| / |b| (absolute when b = 0). */
export function relativeError(a: number, b: number): number {
  return b === 0 ? Math.abs(a) : Math.abs(a - b) / Math.abs(b);
}

/** Day number of 2020-01-01. */
export const DAY0 = 18262;

/**
 * Consecutive periods of `days[i]` days, each at the constant temperature `tempF[i]`, with use
 * per day `usePerDay[i]`. Bills do not share read dates (each starts the day after the last ended).
 */
export function constantTemperatureSeries(
  tempF: readonly number[],
  usePerDay: readonly number[],
  days: readonly number[] | number = 30,
): { bills: BillArrays; temps: DailyTemperatures } {
  const n = tempF.length;
  const len = (i: number): number => (typeof days === 'number' ? days : days[i]!);
  let total = 0;
  for (let i = 0; i < n; i++) total += len(i);
  const mean = new Float64Array(total);
  const startDay = new Int32Array(n);
  const endDay = new Int32Array(n);
  const quantity = new Float64Array(n);
  let d = 0;
  for (let i = 0; i < n; i++) {
    startDay[i] = DAY0 + d;
    for (let j = 0; j < len(i); j++) mean[d++] = tempF[i]!;
    endDay[i] = DAY0 + d - 1;
    quantity[i] = usePerDay[i]! * len(i);
  }
  return { bills: { startDay, endDay, quantity }, temps: packDailyMeans(DAY0, mean) };
}

/** Every number in a value (deep), for never-NaN checks. */
export function allNumbers(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value);
  else if (ArrayBuffer.isView(value)) for (const v of Array.from(value as unknown as ArrayLike<number>)) out.push(Number(v));
  else if (Array.isArray(value)) for (const v of value) allNumbers(v, out);
  else if (value !== null && typeof value === 'object') for (const v of Object.values(value)) allNumbers(v, out);
  return out;
}

/** Small seeded generator (LCG) so tests are reproducible. */
export function seeded(seed: number): { next: () => number; gaussian: () => number } {
  let s = seed >>> 0;
  const next = (): number => {
    s = (Math.imul(s, 1_664_525) + 1_013_904_223) >>> 0;
    return s / 4_294_967_296;
  };
  const gaussian = (): number => Math.sqrt(-2 * Math.log(next() + 1e-12)) * Math.cos(2 * Math.PI * next());
  return { next, gaussian };
}

export interface SyntheticLaw {
  base: number;
  heat: number;
  tauH: number;
  cool: number;
  tauC: number;
  /** Relative noise of each bill. */
  noise: number;
}

/**
 * Daily weather (seasonal + AR(1) noise, 0.5 °F steps) and bills of 26–34 days whose use follows
 * `base + heat·max(0, τH − T) + cool·max(0, T − τC)` per day, times (1 + noise·N(0,1)) per bill.
 */
export function syntheticSeries(law: SyntheticLaw, seed: number, bills = 36): { bills: BillArrays; temps: DailyTemperatures } {
  const r = seeded(seed);
  const days = bills * 34 + 60;
  const mean = new Float64Array(days);
  let ar = 0;
  for (let d = 0; d < days; d++) {
    ar = 0.7 * ar + 5 * r.gaussian();
    mean[d] = Math.round(2 * (55 + 22 * Math.sin((2 * Math.PI * (d - 105)) / 365.25) + ar)) / 2;
  }
  const startDay = new Int32Array(bills);
  const endDay = new Int32Array(bills);
  const quantity = new Float64Array(bills);
  let d = Math.floor(r.next() * 30);
  for (let b = 0; b < bills; b++) {
    const len = 26 + Math.floor(r.next() * 9);
    startDay[b] = DAY0 + d;
    endDay[b] = DAY0 + d + len - 1;
    let q = 0;
    for (let j = d; j < d + len; j++) q += law.base + law.heat * Math.max(0, law.tauH - mean[j]!) + law.cool * Math.max(0, mean[j]! - law.tauC);
    quantity[b] = q * (1 + law.noise * r.gaussian());
    d += len;
  }
  return { bills: { startDay, endDay, quantity }, temps: packDailyMeans(DAY0, mean) };
}
