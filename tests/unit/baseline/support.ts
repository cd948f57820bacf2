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
