/**
 * Checks that need one bill row only: dates in order and not in the future, negative use
 * (possible net metering, CalTRACK 2.0 §2.3.5), zero electricity (counted as missing, §2.2.1.3),
 * missing quantity, cost without quantity, estimated reads (§2.2.3.1). The mask form allocates
 * nothing, for imports of a million rows; expand a non-zero mask to flags with `rowFlags`.
 */
import type { Commodity } from '../domain';
import { isoFromDay } from '../weather/day-number';
import type { BillRow } from './bill';
import { type BillFlag, type BillFlagCode, billFlag, describePeriod } from './flags';

export const ROW_START_AFTER_END = 1;
export const ROW_FUTURE_DATE = 2;
export const ROW_NEGATIVE_USE = 4;
export const ROW_ZERO_ELECTRICITY = 8;
export const ROW_MISSING_QUANTITY = 16;
export const ROW_COST_WITHOUT_QUANTITY = 32;
export const ROW_ESTIMATED_READ = 64;

export interface RowCheckContext {
  commodity: Commodity;
  /** Day number of today; bills ending later are flagged. */
  todayDay: number;
}

/**
 * Bit mask of the row-level problems of one bill (0 = none).
 * @example billRowCheckMask({ startDay: 10, endDay: 5, quantity: 1 }, ctx) // ROW_START_AFTER_END
 */
export function billRowCheckMask(row: BillRow, ctx: RowCheckContext): number {
  let mask = 0;
  if (row.startDay > row.endDay) mask |= ROW_START_AFTER_END;
  if (row.endDay > ctx.todayDay || row.startDay > ctx.todayDay) mask |= ROW_FUTURE_DATE;
  const q = row.quantity;
  if (q === null || !Number.isFinite(q)) {
    mask |= row.cost != null ? ROW_COST_WITHOUT_QUANTITY : ROW_MISSING_QUANTITY;
  } else if (q < 0) {
    mask |= ROW_NEGATIVE_USE;
  } else if (q === 0 && ctx.commodity === 'electricity') {
    mask |= ROW_ZERO_ELECTRICITY;
  }
  if (row.estimated === true) mask |= ROW_ESTIMATED_READ;
  return mask;
}

const MESSAGES: readonly [number, BillFlagCode, (row: BillRow, ctx: RowCheckContext) => string][] = [
  [ROW_START_AFTER_END, 'start-after-end', () => 'starts after it ends; check the two dates'],
  [ROW_FUTURE_DATE, 'future-date', (_r, ctx) => `has a date after today (${isoFromDay(ctx.todayDay)})`],
  [ROW_NEGATIVE_USE, 'negative-use', (r) => `has negative use (${r.quantity}); possible net metering`],
  [ROW_ZERO_ELECTRICITY, 'zero-electricity', () => 'shows zero electricity; counted as missing, not as zero use'],
  [ROW_MISSING_QUANTITY, 'missing-quantity', () => 'has no quantity'],
  [ROW_COST_WITHOUT_QUANTITY, 'cost-without-quantity', (r) => `has a cost (${r.cost}) but no quantity`],
  [ROW_ESTIMATED_READ, 'estimated-read', () => 'is an estimated read; it is best combined with the next actual read'],
];

/** Flags for a row mask; `index` is the row's position reported in each flag. */
export function rowFlags(mask: number, row: BillRow, index: number, ctx: RowCheckContext): BillFlag[] {
  const flags: BillFlag[] = [];
  if (mask === 0) return flags;
  for (const [bit, code, text] of MESSAGES) {
    if ((mask & bit) !== 0) flags.push(billFlag(code, [index], `Bill ${describePeriod(row)} ${text(row, ctx)}.`));
  }
  return flags;
}

/** Row-level flags of one bill. */
export function checkBillRow(row: BillRow, index: number, ctx: RowCheckContext): BillFlag[] {
  return rowFlags(billRowCheckMask(row, ctx), row, index, ctx);
}
