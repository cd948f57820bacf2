/**
 * The real discount rate for Federal life-cycle cost analysis. 10 CFR 436.14 sets it from the
 * 12-month average yield of long-term Treasury bonds adjusted for projected inflation, with a floor
 * of 3 % and a ceiling of 10 %; FEMP publishes it each year in the NISTIR 85-3273 supplement.
 * Plumbline keeps it as a dated, editable setting and rejects values outside the bounds.
 */
import { z } from 'zod';

/** 10 CFR 436.14: the real discount rate is not less than 3 % ... */
export const DISCOUNT_RATE_FLOOR_PERCENT = 3;
/** ... and not more than 10 %. */
export const DISCOUNT_RATE_CEILING_PERCENT = 10;

const BOUNDS_MESSAGE = `Real discount rate must be between ${DISCOUNT_RATE_FLOOR_PERCENT} % and ${DISCOUNT_RATE_CEILING_PERCENT} % (10 CFR 436.14)`;

export const discountRatePercentSchema = z
  .number({
    error: (issue) => (issue.input === undefined ? 'Real discount rate is required' : 'Real discount rate must be a number'),
  })
  .gte(DISCOUNT_RATE_FLOOR_PERCENT, { error: BOUNDS_MESSAGE })
  .lte(DISCOUNT_RATE_CEILING_PERCENT, { error: BOUNDS_MESSAGE });

/** A dated discount-rate setting, as an administrator enters it. */
export const discountRateSettingSchema = z.object({
  realDiscountRatePercent: discountRatePercentSchema,
  effectiveFrom: z.iso.date({ error: 'Effective date must be a date (YYYY-MM-DD)' }),
  source: z.string().trim().min(1, { error: 'Source of the rate is required' }),
});
export type DiscountRateSetting = z.output<typeof discountRateSettingSchema>;

/**
 * Default until an administrator enters the current FEMP rate: 3.0 % real, confirmed for
 * 1 Apr 2010 – 31 Mar 2011 (FEMP news release, 15 Mar 2010). That the rate has stayed at the
 * 3 % floor since is [memory]: confirm against the current NISTIR 85-3273 supplement.
 */
export const DEFAULT_DISCOUNT_RATE_SETTING: DiscountRateSetting = {
  realDiscountRatePercent: 3,
  effectiveFrom: '2010-04-01',
  source: 'FEMP real discount rate, 10 CFR 436.14 (3.0 % confirmed for April 2010 – March 2011; confirm the current year)',
};

/** Applies the 10 CFR 436.14 floor and ceiling to a rate computed from Treasury yields. */
export function clampToFederalDiscountRateBounds(computedPercent: number): number {
  return Math.min(DISCOUNT_RATE_CEILING_PERCENT, Math.max(DISCOUNT_RATE_FLOOR_PERCENT, computedPercent));
}
