/**
 * Data checks on one meter's bill series: the row checks of every bill plus duplicate periods,
 * overlaps beyond a shared read date, gaps over 3 days, periods too short or too long for the
 * billing cycle (CalTRACK 2.0 §2.2.3.4-5) and outliers more than 3 IQR above the median use per
 * day (§2.3.6). Flag, never drop.
 */
import { type BillRow, hasQuantity } from './bill';
import { effectivePeriods, type EffectivePeriods } from './effective-periods';
import { BILL_FLAG_CODES, type BillFlag, billFlag, describePeriod } from './flags';
import { quantileSorted } from './quantile';
import { billRowCheckMask, type RowCheckContext, rowFlags } from './row-checks';

// Source: CalTRACK 2.0 §2.2.3.4, off-cycle reads shorter than 25 days are dropped from the baseline.
export const MIN_PERIOD_DAYS = 25;
// Source: CalTRACK 2.0 §2.2.3.5, periods over 35 days (monthly billing) are dropped.
export const MAX_MONTHLY_PERIOD_DAYS = 35;
// Source: CalTRACK 2.0 §2.2.3.5, periods over 70 days (bimonthly billing) are dropped.
export const MAX_BIMONTHLY_PERIOD_DAYS = 70;
// Source: common practice: a few unbilled days between reads are normal, longer gaps lose use.
export const MAX_GAP_DAYS = 3;
// Source: CalTRACK 2.0 §2.3.6, usage more than 3 interquartile ranges above the median is an outlier.
export const OUTLIER_IQR_MULTIPLE = 3;
// Source: common practice: quartiles need at least four values to mean anything.
export const MIN_OUTLIER_SAMPLE = 4;

export type BillingCycle = 'monthly' | 'bimonthly' | 'any';

export interface SeriesCheckOptions extends RowCheckContext {
  /** Expected cycle for the length checks; 'any' skips them. Default 'monthly'. */
  billing?: BillingCycle;
}

function sequenceFlags(bills: readonly BillRow[], eff: EffectivePeriods, out: BillFlag[]): void {
  let prev = -1;
  let maxEnd = -Infinity;
  let maxEndBill = -1;
  let group: number[] = [];
  const closeGroup = (): void => {
    if (group.length > 1) {
      const b = bills[group[0] as number] as BillRow;
      out.push(billFlag('duplicate-period', group, `${group.length} bills cover the same period ${describePeriod(b)}.`));
    }
  };
  for (const i of eff.order) {
    const b = bills[i] as BillRow;
    if (b.startDay > b.endDay) continue;
    const p = prev >= 0 ? (bills[prev] as BillRow) : undefined;
    if (p !== undefined && p.startDay === b.startDay && p.endDay === b.endDay) {
      group.push(i);
      continue;
    }
    closeGroup();
    group = [i];
    if (maxEndBill >= 0 && b.startDay < maxEnd) {
      const days = Math.min(b.endDay, maxEnd) - b.startDay + 1;
      const other = bills[maxEndBill] as BillRow;
      out.push(billFlag('overlapping-periods', [maxEndBill, i],
        `Bills ${describePeriod(other)} and ${describePeriod(b)} share ${days} days; only one shared read date is expected.`));
    } else if (maxEndBill >= 0 && b.startDay - maxEnd - 1 > MAX_GAP_DAYS) {
      const days = b.startDay - maxEnd - 1;
      const other = bills[maxEndBill] as BillRow;
      out.push(billFlag('gap', [maxEndBill, i],
        `${days} days between bills ${describePeriod(other)} and ${describePeriod(b)} are not billed.`));
    }
    if (b.endDay > maxEnd) {
      maxEnd = b.endDay;
      maxEndBill = i;
    }
    prev = i;
  }
  closeGroup();
}

function lengthFlags(bills: readonly BillRow[], eff: EffectivePeriods, billing: BillingCycle, out: BillFlag[]): void {
  if (billing === 'any') return;
  const max = billing === 'monthly' ? MAX_MONTHLY_PERIOD_DAYS : MAX_BIMONTHLY_PERIOD_DAYS;
  for (let i = 0; i < bills.length; i++) {
    const days = eff.days[i] as number;
    if (days === 0) continue;
    const b = bills[i] as BillRow;
    if (days < MIN_PERIOD_DAYS) {
      out.push(billFlag('short-period', [i], `Bill ${describePeriod(b)} covers ${days} days, fewer than ${MIN_PERIOD_DAYS}.`));
    } else if (days > max) {
      out.push(billFlag('long-period', [i], `Bill ${describePeriod(b)} covers ${days} days, more than ${max} for ${billing} billing.`));
    }
  }
}

function outlierFlags(bills: readonly BillRow[], eff: EffectivePeriods, ctx: RowCheckContext, out: BillFlag[]): void {
  const upd = new Float64Array(bills.length);
  const used: number[] = [];
  for (let i = 0; i < bills.length; i++) {
    const b = bills[i] as BillRow;
    const days = eff.days[i] as number;
    // Zero electricity counts as missing (CalTRACK 2.0 §2.2.1.3), so it does not shape the quartiles.
    if (days === 0 || !hasQuantity(b) || (b.quantity === 0 && ctx.commodity === 'electricity')) continue;
    upd[i] = b.quantity / days;
    used.push(i);
  }
  if (used.length < MIN_OUTLIER_SAMPLE) return;
  const sorted = Float64Array.from(used, (i) => upd[i] as number).sort();
  const median = quantileSorted(sorted, 0.5);
  const iqr = quantileSorted(sorted, 0.75) - quantileSorted(sorted, 0.25);
  const limit = median + OUTLIER_IQR_MULTIPLE * iqr;
  for (const i of used) {
    if ((upd[i] as number) <= limit) continue;
    out.push(billFlag('outlier', [i],
      `Bill ${describePeriod(bills[i] as BillRow)} uses ${fmt(upd[i] as number)} per day, more than 3 IQR above the median (${fmt(median)} per day, IQR ${fmt(iqr)}).`));
  }
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

const CODE_RANK = new Map(BILL_FLAG_CODES.map((c, k) => [c, k]));

/**
 * All checks on one meter's bills, ordered by first bill concerned, then by code.
 * @example checkBillSeries(bills, { commodity: 'electricity', todayDay: dayFromIso('2025-01-01')! })
 */
export function checkBillSeries(bills: readonly BillRow[], options: SeriesCheckOptions): BillFlag[] {
  const out: BillFlag[] = [];
  for (let i = 0; i < bills.length; i++) {
    const b = bills[i] as BillRow;
    const mask = billRowCheckMask(b, options);
    if (mask !== 0) out.push(...rowFlags(mask, b, i, options));
  }
  const eff = effectivePeriods(bills);
  sequenceFlags(bills, eff, out);
  lengthFlags(bills, eff, options.billing ?? 'monthly', out);
  outlierFlags(bills, eff, options, out);
  return out.sort(
    (x, y) => Math.min(...x.bills) - Math.min(...y.bills) || (CODE_RANK.get(x.code) ?? 0) - (CODE_RANK.get(y.code) ?? 0),
  );
}
