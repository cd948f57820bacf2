/** Bills prepared for a baseline fit: CalTRACK 2.0's rules on estimated reads, zero electricity and units. */
import { describe, expect, it } from 'vitest';
import { prepareBaselineBills, type BaselineBill } from '../../../src/lib/baseline/prepare';

const day = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / 86_400_000;
const bill = (s: string, e: string, quantity: number, extra: Partial<BaselineBill> = {}): BaselineBill => ({ startDay: day(s), endDay: day(e), quantity, unit: 'kWh', estimated: false, ...extra });
const window = { fromDay: day('2020-01-01'), toDay: day('2030-12-31') };

describe('prepareBaselineBills', () => {
  it('combines an estimated read with the next actual read into one period', () => {
    // Source: CalTRACK 2.0 §2.2.3.1 — estimated reads are combined with the next period (up to 70 days).
    const r = prepareBaselineBills([bill('2024-01-01', '2024-01-31', 900), bill('2024-02-01', '2024-02-29', 400, { estimated: true }), bill('2024-03-01', '2024-03-31', 1500)], { commodity: 'electricity', unit: 'kWh', ...window });
    expect(Array.from(r.quantity)).toEqual([900, 1900]);
    expect(Array.from(r.startDay)).toEqual([day('2024-01-01'), day('2024-02-01')]);
    expect(Array.from(r.endDay)).toEqual([day('2024-01-31'), day('2024-03-31')]);
    expect(r.notes.estimatedCombined).toBe(1);
  });

  it('leaves out an estimated read when combining would exceed 70 days, or when it is the last bill', () => {
    const r = prepareBaselineBills([bill('2024-01-01', '2024-02-20', 900, { estimated: true }), bill('2024-02-21', '2024-03-31', 800), bill('2024-04-01', '2024-04-30', 700, { estimated: true })], { commodity: 'electricity', unit: 'kWh', ...window });
    expect(Array.from(r.quantity)).toEqual([800]);
    expect(r.notes.estimatedDropped).toBe(2);
  });

  it('counts zero electricity as missing but keeps zero gas', () => {
    // Source: CalTRACK 2.0 §2.2.1.3–4 — 0 counts as missing for electricity, not for gas.
    const e = prepareBaselineBills([bill('2024-01-01', '2024-01-31', 0), bill('2024-02-01', '2024-02-29', 10)], { commodity: 'electricity', unit: 'kWh', ...window });
    expect(Array.from(e.quantity)).toEqual([10]);
    expect(e.notes.zeroElectricityDropped).toBe(1);
    const g = prepareBaselineBills([bill('2024-07-01', '2024-07-31', 0, { unit: 'therm' }), bill('2024-08-01', '2024-08-31', 3, { unit: 'therm' })], { commodity: 'natural_gas', unit: 'therm', ...window });
    expect(Array.from(g.quantity)).toEqual([0, 3]);
  });

  it('converts a bill in another unit to the meter unit', () => {
    // Source: U.S. EIA, Units and calculators explained: 1 MWh = 1,000 kWh (3,412,000 Btu); 1 Dth = 10 therms.
    const e = prepareBaselineBills([bill('2024-01-01', '2024-01-31', 2, { unit: 'MWh' })], { commodity: 'electricity', unit: 'kWh', ...window });
    expect(e.quantity[0]).toBeCloseTo(2000, 9);
    const g = prepareBaselineBills([bill('2024-01-01', '2024-01-31', 3, { unit: 'Dth' })], { commodity: 'natural_gas', unit: 'therm', ...window });
    expect(g.quantity[0]).toBeCloseTo(30, 9);
  });

  it('keeps only bills inside the window, and leaves out negative use', () => {
    const r = prepareBaselineBills([bill('2019-12-01', '2019-12-31', 5), bill('2024-01-01', '2024-01-31', -40), bill('2024-02-01', '2024-02-29', 7)], { commodity: 'electricity', unit: 'kWh', ...window });
    expect(Array.from(r.quantity)).toEqual([7]);
    expect(r.notes).toMatchObject({ outsideWindow: 1, negativeDropped: 1 });
  });
});
