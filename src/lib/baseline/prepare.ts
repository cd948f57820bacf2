/**
 * Bills of one meter made ready for a baseline fit (methods.md §2):
 * - quantities in one unit (the meter's), converted through site energy or gallons when a bill
 *   is stated in another unit of the same commodity;
 * - an estimated read combined with the following actual read into one period, as long as the
 *   combined period stays within 70 days (CalTRACK 2.0 §2.2.3.1);
 * - zero electricity counted as missing, i.e. left out (CalTRACK 2.0 §2.2.1.3); negative use
 *   (net metering, corrections) left out of a consumption baseline (§2.3.5 flags it);
 * - bills inside the baseline window [fromDay, toDay] only.
 * Every change is counted so the analyst sees what was done.
 */
import type { Commodity, Unit } from '../domain';
import { conversionFactor, type MeterHeatContent } from '../units/convert';

export interface BaselineBill {
  startDay: number;
  endDay: number;
  quantity: number;
  unit: Unit;
  estimated: boolean;
}

export interface PreparedBills {
  startDay: Int32Array;
  endDay: Int32Array;
  quantity: Float64Array;
  notes: {
    /** Estimated reads folded into the next actual read. */
    estimatedCombined: number;
    /** Estimated reads that could not be combined (last bill, or over 70 days) and were left out. */
    estimatedDropped: number;
    zeroElectricityDropped: number;
    negativeDropped: number;
    /** Bills in a unit that cannot be converted to the meter's. */
    unconvertible: number;
    outsideWindow: number;
  };
}

// Source: CalTRACK 2.0 §2.2.3.1, estimated reads are combined with the next period up to 70 days.
export const MAX_COMBINED_DAYS = 70;

export function prepareBaselineBills(
  bills: readonly BaselineBill[],
  opts: { commodity: Commodity; unit: Unit; heat?: MeterHeatContent; fromDay: number; toDay: number },
): PreparedBills {
  const notes = { estimatedCombined: 0, estimatedDropped: 0, zeroElectricityDropped: 0, negativeDropped: 0, unconvertible: 0, outsideWindow: 0 };
  const target = conversionFactor(opts.commodity, opts.unit, opts.heat);
  const factorCache = new Map<Unit, number | null>();
  const factor = (u: Unit): number | null => {
    if (u === opts.unit) return 1;
    if (!factorCache.has(u)) {
      const f = conversionFactor(opts.commodity, u, opts.heat);
      factorCache.set(u, f.ok && target.ok ? f.perUnit / target.perUnit : null);
    }
    return factorCache.get(u)!;
  };
  const sorted = [...bills].sort((a, b) => a.startDay - b.startDay || a.endDay - b.endDay);
  const out: { s: number; e: number; q: number }[] = [];
  let pending: { s: number; e: number; q: number } | null = null;
  for (const b of sorted) {
    if (b.endDay < opts.fromDay || b.startDay > opts.toDay || b.startDay < opts.fromDay || b.endDay > opts.toDay) {
      notes.outsideWindow++;
      continue;
    }
    const f = factor(b.unit);
    if (f === null) {
      notes.unconvertible++;
      continue;
    }
    const q = b.quantity * f;
    if (opts.commodity === 'electricity' && q === 0 && !b.estimated) {
      notes.zeroElectricityDropped++;
      continue;
    }
    if (q < 0) {
      notes.negativeDropped++;
      continue;
    }
    if (pending) {
      if (b.endDay - pending.s + 1 <= MAX_COMBINED_DAYS && b.startDay <= pending.e + 1 + 3) {
        const merged: { s: number; e: number; q: number } = { s: pending.s, e: b.endDay, q: pending.q + q };
        notes.estimatedCombined++;
        pending = null;
        if (b.estimated) pending = merged;
        else out.push(merged);
        continue;
      }
      notes.estimatedDropped++;
      pending = null;
    }
    if (b.estimated) pending = { s: b.startDay, e: b.endDay, q };
    else out.push({ s: b.startDay, e: b.endDay, q });
  }
  if (pending) notes.estimatedDropped++;
  return {
    startDay: Int32Array.from(out, (x) => x.s),
    endDay: Int32Array.from(out, (x) => x.e),
    quantity: Float64Array.from(out, (x) => x.q),
    notes,
  };
}
