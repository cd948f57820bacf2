/**
 * Data-check flags on one meter's bills. Checks flag, they never drop: each flag names the
 * bills concerned (indices into the caller's array), a code, a severity and a plain message.
 */
import { isoFromDay } from '../weather/day-number';
import type { BillPeriod } from './bill';

export const BILL_FLAG_CODES = [
  'start-after-end',
  'future-date',
  'duplicate-period',
  'overlapping-periods',
  'gap',
  'short-period',
  'long-period',
  'negative-use',
  'zero-electricity',
  'missing-quantity',
  'cost-without-quantity',
  'outlier',
  'estimated-read',
] as const;
export type BillFlagCode = (typeof BILL_FLAG_CODES)[number];

export type FlagSeverity = 'error' | 'warning' | 'info';

/** error: the bill cannot be right as stated; warning: check it; info: worth knowing. */
export const BILL_FLAG_SEVERITY: Readonly<Record<BillFlagCode, FlagSeverity>> = {
  'start-after-end': 'error',
  'future-date': 'error',
  'duplicate-period': 'error',
  'overlapping-periods': 'warning',
  gap: 'warning',
  'short-period': 'warning',
  'long-period': 'warning',
  'negative-use': 'warning',
  'zero-electricity': 'warning',
  'missing-quantity': 'warning',
  'cost-without-quantity': 'warning',
  outlier: 'warning',
  'estimated-read': 'info',
};

export interface BillFlag {
  code: BillFlagCode;
  severity: FlagSeverity;
  /** Indices of the bills concerned in the array that was checked. */
  bills: number[];
  message: string;
}

/** A flag with the severity of its code. */
export function billFlag(code: BillFlagCode, bills: number[], message: string): BillFlag {
  return { code, severity: BILL_FLAG_SEVERITY[code], bills, message };
}

/** "2024-01-05 to 2024-02-03", for messages. */
export function describePeriod(bill: BillPeriod): string {
  return `${isoFromDay(bill.startDay)} to ${isoFromDay(bill.endDay)}`;
}
