/**
 * Messy data, each on its own ordinary meter and recorded in truth.messy:
 *   gap        two consecutive bills missing (about 40 % through the series);
 *   estimated  a winter heating-fuel bill estimated from the three bills before it
 *              (use per day × days), then an actual catch-up read so the two bills together hold
 *              the true use;
 *   duplicate  one bill (about a year ago) delivered twice with the same values;
 *   zero-read  one electricity bill read as 0 (a stuck register; no charge, no demand).
 */
import { dayToCivil, dayToIso } from './dates';
import { round } from './load-parameters';
import { quantityDecimals } from './meters';
import type { DraftBill } from './bills';
import type { DemoMeter, MessyItem } from './types';

export interface MessyPicks {
  gap: DemoMeter;
  estimated: DemoMeter;
  duplicate: DemoMeter;
  zeroRead: DemoMeter;
}

/** Apply the messy edits in place to each picked meter's drafts and describe them. */
export function applyMessyData(drafts: Map<string, DraftBill[]>, picks: MessyPicks): MessyItem[] {
  return [gap(drafts, picks.gap), estimated(drafts, picks.estimated), duplicate(drafts, picks.duplicate), zeroRead(drafts, picks.zeroRead)];
}

function billsOf(drafts: Map<string, DraftBill[]>, meter: DemoMeter): DraftBill[] {
  const bills = drafts.get(meter.code);
  if (!bills || bills.length < 24) throw new Error(`messy data needs a meter with two years of bills: ${meter.code}`);
  return bills;
}

function at(bills: DraftBill[], i: number): DraftBill {
  const bill = bills[i];
  if (!bill) throw new Error(`no bill at index ${i}`);
  return bill;
}

function gap(drafts: Map<string, DraftBill[]>, meter: DemoMeter): MessyItem {
  const bills = billsOf(drafts, meter);
  const i = Math.floor(bills.length * 0.4);
  const [first, second] = bills.splice(i, 2) as [DraftBill, DraftBill];
  const days = second.period.end - first.period.start + 1;
  return {
    kind: 'gap',
    meterCode: meter.code,
    periodStart: dayToIso(first.period.start),
    detail: `Two bills missing: ${dayToIso(first.period.start)} to ${dayToIso(second.period.end)} (${days} days with no bill).`,
  };
}

function estimated(drafts: Map<string, DraftBill[]>, meter: DemoMeter): MessyItem {
  const bills = billsOf(drafts, meter);
  const lo = Math.floor(bills.length * 0.3);
  const hi = Math.floor(bills.length * 0.7);
  let i = lo;
  for (let k = lo; k <= hi; k++) {
    const month = dayToCivil(at(bills, k).period.coveredFrom).month;
    if (month === 12 || month === 1) {
      i = k;
      break;
    }
  }
  const bill = at(bills, i);
  const next = at(bills, i + 1);
  let perDay = 0;
  for (let k = i - 3; k < i; k++) {
    const b = at(bills, k);
    perDay += b.quantity / (b.period.end - b.period.coveredFrom + 1) / 3;
  }
  const decimals = quantityDecimals(meter.unit);
  const both = bill.quantity + next.quantity;
  const guess = round(Math.min(perDay * (bill.period.end - bill.period.coveredFrom + 1), 0.9 * both), decimals);
  const catchUp = round(both - guess, decimals);
  const actual = bill.quantity;
  bill.quantity = guess;
  bill.estimated = true;
  next.quantity = catchUp;
  return {
    kind: 'estimated',
    meterCode: meter.code,
    periodStart: dayToIso(bill.period.start),
    detail:
      `Bill ${dayToIso(bill.period.start)} to ${dayToIso(bill.period.end)} estimated at ${guess} ${meter.unit} ` +
      `(the read would have given ${actual}); the next bill, to ${dayToIso(next.period.end)}, is an actual read ` +
      `of ${catchUp} ${meter.unit} that catches up, so the two together hold the true ${round(both, decimals)} ${meter.unit}.`,
  };
}

function duplicate(drafts: Map<string, DraftBill[]>, meter: DemoMeter): MessyItem {
  const bills = billsOf(drafts, meter);
  const i = bills.length - 13;
  const bill = at(bills, i);
  bills.splice(i + 1, 0, { ...bill });
  return {
    kind: 'duplicate',
    meterCode: meter.code,
    periodStart: dayToIso(bill.period.start),
    detail: `Bill ${dayToIso(bill.period.start)} to ${dayToIso(bill.period.end)} (${bill.quantity} ${meter.unit}) appears twice with the same values.`,
  };
}

function zeroRead(drafts: Map<string, DraftBill[]>, meter: DemoMeter): MessyItem {
  const bills = billsOf(drafts, meter);
  const bill = at(bills, Math.floor(bills.length * 0.6));
  bill.quantity = 0;
  bill.unitPrice = 0;
  bill.demandKw = null;
  return {
    kind: 'zero-read',
    meterCode: meter.code,
    periodStart: dayToIso(bill.period.start),
    detail: `Electricity bill ${dayToIso(bill.period.start)} to ${dayToIso(bill.period.end)} read 0 kWh (stuck register; no charge). Zero electricity counts as missing (CalTRACK 2.0 §2.2.1.3).`,
  };
}
