import { describe, expect, it } from 'vitest';
import {
  DEFAULT_DISCOUNT_RATE_SETTING,
  clampToFederalDiscountRateBounds,
  discountRatePercentSchema,
  discountRateSettingSchema,
} from '../../../src/lib/economics/discount-rate';

describe('real discount rate (10 CFR 436.14)', () => {
  it('accepts the bounds 3 % and 10 % and rejects 2 % and 11 % with a message citing the rule', () => {
    // Source: 10 CFR 436.14: real discount rate not less than 3 % and not more than 10 %
    expect(discountRatePercentSchema.safeParse(3).success).toBe(true);
    expect(discountRatePercentSchema.safeParse(10).success).toBe(true);
    for (const bad of [2, 11]) {
      const parsed = discountRatePercentSchema.safeParse(bad);
      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues[0]?.message).toBe('Real discount rate must be between 3 % and 10 % (10 CFR 436.14)');
    }
  });

  it('clamps a computed Treasury-based rate to the floor and ceiling', () => {
    // Source: 10 CFR 436.14: a computed 1.9 % real rate is used as 3.0 %; 12 % as 10 %
    expect(clampToFederalDiscountRateBounds(1.9)).toBe(3);
    expect(clampToFederalDiscountRateBounds(12)).toBe(10);
    expect(clampToFederalDiscountRateBounds(4.2)).toBe(4.2);
  });

  it('keeps the rate as a dated setting; the default is the FEMP 3.0 % real rate of April 2010', () => {
    // Source: FEMP news release, 15 Mar 2010: real discount rate 3.0 % for 1 Apr 2010 – 31 Mar 2011
    expect(discountRateSettingSchema.parse(DEFAULT_DISCOUNT_RATE_SETTING)).toEqual(DEFAULT_DISCOUNT_RATE_SETTING);
    expect(DEFAULT_DISCOUNT_RATE_SETTING.realDiscountRatePercent).toBe(3);
    const bad = discountRateSettingSchema.safeParse({ realDiscountRatePercent: 3, effectiveFrom: '2024-13-01', source: 'x' });
    expect(bad.error?.issues[0]?.path).toEqual(['effectiveFrom']);
  });
});
