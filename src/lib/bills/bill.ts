/**
 * One meter's bill as the computations see it: a period [startDay, endDay] with both dates
 * inclusive (days = end − start + 1; day numbers from ../weather/day-number), a quantity in the
 * meter's unit or in converted kBtu/gallons, and optional cost and estimated-read flag.
 */
import { z } from 'zod';

export const billRowSchema = z.object({
  startDay: z.number().int(),
  endDay: z.number().int(),
  /** null when the bill states no quantity. */
  quantity: z.number().nullable(),
  cost: z.number().nullable().optional(),
  estimated: z.boolean().optional(),
});
export type BillRow = z.infer<typeof billRowSchema>;

/** The dates of a bill, all most computations need. */
export interface BillPeriod {
  startDay: number;
  endDay: number;
}

/**
 * Days in a period, both dates inclusive: end − start + 1 (0 when start is after end).
 * @example billDays(dayFromIso('2024-01-01'), dayFromIso('2024-01-31')) // 31
 */
export function billDays(startDay: number, endDay: number): number {
  return endDay >= startDay ? endDay - startDay + 1 : 0;
}

/** True when the bill carries a usable quantity. */
export function hasQuantity(bill: { quantity: number | null }): bill is { quantity: number } {
  return bill.quantity !== null && Number.isFinite(bill.quantity);
}
