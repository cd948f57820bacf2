/**
 * Fit a baseline from plain data that came from outside (an API body, a parsed file): bills with
 * ISO dates and daily Tmax/Tmin rows, validated with zod, then handed to the engine.
 */
import { z } from 'zod';
import { isoDateSchema, isoDateToDay } from './calendar-days';
import { dailyTemperatureRowSchema, dailyTemperaturesFromRows } from './daily-temperatures';
import type { BillArrays } from './bill-periods';
import { BaselineEngine, fitOptionsSchema, type BaselineResult } from './engine';

/** One bill: both dates inclusive, quantity in the meter's unit. */
export const billSchema = z.object({
  start: isoDateSchema,
  end: isoDateSchema,
  quantity: z.number(),
});
export type Bill = z.infer<typeof billSchema>;

export const fitBaselineInputSchema = z.object({
  bills: z.array(billSchema),
  temperatures: z.array(dailyTemperatureRowSchema),
  options: fitOptionsSchema.optional(),
});
export type FitBaselineInput = z.input<typeof fitBaselineInputSchema>;

/** Pack validated bills into the engine's parallel arrays. */
export function packBills(bills: readonly Bill[]): BillArrays {
  const n = bills.length;
  const startDay = new Int32Array(n);
  const endDay = new Int32Array(n);
  const quantity = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    startDay[i] = isoDateToDay(bills[i]!.start)!;
    endDay[i] = isoDateToDay(bills[i]!.end)!;
    quantity[i] = bills[i]!.quantity;
  }
  return { startDay, endDay, quantity };
}

let sharedEngine: BaselineEngine | null = null;

/**
 * Fit the baseline of one series.
 * @example fitBaseline({ bills: [{ start: '2023-01-01', end: '2023-01-31', quantity: 230 }, ...],
 *   temperatures: [{ date: '2023-01-01', tmaxF: 40, tminF: 28 }, ...] })
 * @returns the fit, or a typed reason (`invalid-input` when the data do not parse)
 */
export function fitBaseline(input: FitBaselineInput): BaselineResult {
  const parsed = fitBaselineInputSchema.safeParse(input);
  const empty = { used: 0, firstDay: null, lastDay: null, dropped: [], sharedReadDates: 0, overlaps: 0, rows: null };
  if (!parsed.success) {
    return { ok: false, reason: 'invalid-input', detail: z.prettifyError(parsed.error), periods: empty };
  }
  const temps = dailyTemperaturesFromRows(parsed.data.temperatures);
  if (temps === null) {
    return { ok: false, reason: 'insufficient-temperature', detail: 'no daily temperatures were given', periods: empty };
  }
  sharedEngine ??= new BaselineEngine();
  return sharedEngine.fit(packBills(parsed.data.bills), temps, fitOptionsSchema.parse(parsed.data.options ?? {}));
}
