import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseNumberCell } from '../../../src/lib/formats/cell-number';

// Reference: Intl.NumberFormat (ICU with Unicode CLDR number patterns) writes numbers as
// en-US ("1,234.5", "($1,234.56)" in accounting style) and de-DE ("1.234,5") spreadsheets do.
const cents = fc.integer({ min: -999_999_999, max: 999_999_999 });
const money = (c: number): number => c / 100;

function value(raw: string, mark: 'point' | 'comma' | 'auto'): number | null {
  const r = parseNumberCell(raw, mark);
  return r.ok ? r.value : null;
}

describe('parseNumberCell against Intl.NumberFormat', () => {
  it('reads en-US grouped numbers in point mode', () => {
    const f = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
    fc.assert(
      fc.property(cents, (c) => {
        expect(value(f.format(money(c)), 'point')).toBe(money(c));
      }),
    );
  });

  it('reads en-US accounting currency: $ and parentheses for negatives', () => {
    const f = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', currencySign: 'accounting' });
    expect(f.format(-1234.56)).toBe('($1,234.56)');
    fc.assert(
      fc.property(cents, (c) => {
        expect(value(f.format(money(c)), 'point')).toBe(money(c));
      }),
    );
  });

  it('reads de-DE numbers and euro amounts in comma mode', () => {
    const n = new Intl.NumberFormat('de-DE', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
    const eur = new Intl.NumberFormat('de-DE', { style: 'currency', currency: 'EUR' });
    fc.assert(
      fc.property(cents, (c) => {
        expect(value(n.format(money(c)), 'comma')).toBe(money(c));
        expect(value(eur.format(money(c)), 'comma')).toBe(money(c)); // "-1.234,56 €" with a no-break space
      }),
    );
  });

  it('reads both styles in auto mode when both marks or two decimals make them unambiguous', () => {
    const us = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
    const de = new Intl.NumberFormat('de-DE', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
    fc.assert(
      fc.property(cents, (c) => {
        const a = parseNumberCell(us.format(money(c)), 'auto');
        const b = parseNumberCell(de.format(money(c)), 'auto');
        expect(a).toEqual({ ok: true, value: money(c), ambiguous: false });
        expect(b).toEqual({ ok: true, value: money(c), ambiguous: false });
      }),
    );
  });
});

describe('parseNumberCell against Number() (ECMA-262 StringToNumber, correctly rounded)', () => {
  it('gives exactly the double Number() gives, with and without grouping, any digit count', () => {
    const digitString = (min: number, max: number) =>
      fc.array(fc.integer({ min: 0, max: 9 }), { minLength: min, maxLength: max }).map((d) => d.join(''));
    fc.assert(
      fc.property(digitString(1, 20), digitString(0, 25), fc.boolean(), (int, frac, negative) => {
        const plain = `${negative ? '-' : ''}${int}${frac === '' ? '' : `.${frac}`}`;
        const grouped = `${negative ? '-' : ''}${Number(int).toString() === int ? new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(BigInt(int)) : int}${frac === '' ? '' : `.${frac}`}`;
        expect(value(plain, 'point')).toBe(Number(plain) === 0 ? 0 : Number(plain));
        expect(value(grouped, 'point')).toBe(Number(plain) === 0 ? 0 : Number(plain));
      }),
      { numRuns: 2000 },
    );
  });
});

describe('parseNumberCell rules (constructed cases)', () => {
  it('flags a single mark before exactly three digits as ambiguous in auto mode', () => {
    expect(parseNumberCell('2,500', 'auto')).toEqual({ ok: true, value: 2.5, ambiguous: true });
    expect(parseNumberCell('1.234', 'auto')).toEqual({ ok: true, value: 1.234, ambiguous: true });
    expect(parseNumberCell('0,125', 'auto')).toEqual({ ok: true, value: 0.125, ambiguous: false });
    expect(parseNumberCell('1.234.567', 'auto')).toEqual({ ok: true, value: 1234567, ambiguous: false });
  });

  it('refuses misplaced separators instead of guessing', () => {
    expect(parseNumberCell('1,23', 'point')).toMatchObject({ ok: false, why: expect.stringContaining('wrong places') });
    expect(parseNumberCell('12,34,567', 'point').ok).toBe(false);
    expect(parseNumberCell('1.2.3', 'point')).toMatchObject({ ok: false, why: 'has two decimal marks' });
    expect(parseNumberCell('1 234,5', 'comma')).toEqual({ ok: true, value: 1234.5, ambiguous: false });
  });

  it('handles signs, currency codes, trailing minus and exponents', () => {
    expect(value('-$12.00', 'point')).toBe(-12);
    expect(value('$-12.00', 'point')).toBe(-12);
    expect(value('USD 1,000', 'point')).toBe(1000);
    expect(value('1000 usd', 'point')).toBe(1000);
    expect(value('12.50-', 'point')).toBe(-12.5);
    expect(value('1.5E3', 'point')).toBe(1500);
    expect(value('\u22125', 'point')).toBe(-5);
    expect(value('(0)', 'point')).toBe(0);
    expect(Object.is(value('-0', 'point'), 0)).toBe(true);
  });

  it('refuses text, double signs and bare symbols', () => {
    for (const bad of ['', '$', 'abc', '12a', '--5', '(-5)', '1-2', '5%', 'e5', '1e', '1,000e3']) {
      expect(parseNumberCell(bad, 'point').ok).toBe(false);
    }
    expect(parseNumberCell('9'.repeat(400), 'point').ok).toBe(false);
  });
});
