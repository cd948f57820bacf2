import { describe, expect, it } from 'vitest';
import { generateDemoScenario } from '../../../src/db/seed/scenario';
import { billsByMeter, dailyMeanMap, dayNumber, expectedPerDay, stationOfMeter } from './scenario-helpers';

const scenario = generateDemoScenario();
const byMeter = billsByMeter(scenario);
const item = (kind: string) => {
  const found = scenario.truth.messy.filter((m) => m.kind === kind);
  expect(found, kind).toHaveLength(1);
  return found[0]!;
};

describe('demo messy data', () => {
  it('puts each messy item on its own meter of an ordinary building', () => {
    const meters = scenario.truth.messy.map((m) => m.meterCode);
    expect(new Set(meters).size).toBe(meters.length);
    const special = new Set([scenario.truth.retrofit.buildingNumber, ...scenario.truth.poorPerformers.map((p) => p.buildingNumber)]);
    for (const code of meters) {
      const m = scenario.meters.find((x) => x.code === code)!;
      expect(special.has(m.buildingNumber)).toBe(false);
    }
  });

  it('has a gap: two bills missing on one meter, and nowhere else', () => {
    const gap = item('gap');
    const bills = byMeter.get(gap.meterCode)!;
    const breaks = bills.slice(1).map((b, i) => ({ days: dayNumber(b.bill.periodStart) - dayNumber(bills[i]!.bill.periodEnd) - 1, after: bills[i]! }));
    const big = breaks.filter((x) => x.days > 3);
    expect(big).toHaveLength(1);
    // Two monthly bills: between 2·27 and 2·34 days without a bill.
    expect(big[0]!.days).toBeGreaterThanOrEqual(54);
    expect(big[0]!.days).toBeLessThanOrEqual(68);
    expect(dayNumber(gap.periodStart)).toBe(dayNumber(big[0]!.after.bill.periodEnd) + 1);
  });

  it('has one estimated read followed by an actual catch-up, the two together within noise of the truth', () => {
    const est = item('estimated');
    const estimated = scenario.bills.filter((b) => b.estimated);
    expect(estimated).toHaveLength(1);
    expect(estimated[0]!.meterCode).toBe(est.meterCode);
    expect(estimated[0]!.periodStart).toBe(est.periodStart);
    const bills = byMeter.get(est.meterCode)!;
    const i = bills.findIndex((b) => b.bill.estimated);
    const [first, next] = [bills[i]!, bills[i + 1]!];
    expect(next.bill.estimated).toBe(false);
    const truth = scenario.truth.meters[est.meterCode]!;
    const means = dailyMeanMap(stationOfMeter(scenario, est.meterCode));
    const expectedBoth = expectedPerDay(truth, means, first.from, first.to) * first.days + expectedPerDay(truth, means, next.from, next.to) * next.days;
    const both = first.bill.quantity + next.bill.quantity;
    expect(Math.abs(both / expectedBoth - 1)).toBeLessThan(4 * truth.noiseCv);
    // The estimate alone is off from its own period's expectation (it is a guess) but positive.
    expect(first.bill.quantity).toBeGreaterThan(0);
    expect(next.bill.quantity).toBeGreaterThan(0);
  });

  it('has one duplicate bill: the same period twice with the same values', () => {
    const dup = item('duplicate');
    const seen = new Map<string, number>();
    for (const b of scenario.bills) {
      const key = `${b.meterCode}|${b.periodStart}|${b.periodEnd}`;
      seen.set(key, (seen.get(key) ?? 0) + 1);
    }
    const repeated = [...seen].filter(([, n]) => n > 1);
    expect(repeated).toHaveLength(1);
    expect(repeated[0]![0].startsWith(`${dup.meterCode}|${dup.periodStart}|`)).toBe(true);
    const copies = scenario.bills.filter((b) => b.meterCode === dup.meterCode && b.periodStart === dup.periodStart);
    expect(copies[0]).toEqual(copies[1]);
  });

  it('has one zero electricity read', () => {
    const zero = item('zero-read');
    const zeros = scenario.bills.filter((b) => b.quantity === 0);
    expect(zeros).toHaveLength(1);
    expect(zeros[0]!.meterCode).toBe(zero.meterCode);
    expect(zeros[0]!.periodStart).toBe(zero.periodStart);
    expect(scenario.meters.find((m) => m.code === zero.meterCode)!.commodity).toBe('electricity');
  });
});
