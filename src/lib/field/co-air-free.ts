/**
 * Carbon monoxide corrected to air-free: CO_af = CO_measured · 20.9 / (20.9 − O2), ppm, O2 in %
 * of dry flue gas; and the ANSI Z21 appliance certification limits on air-free CO.
 *
 * @example
 * coAirFreePpm(50, 7) // 75.2
 */

/** O2 in fresh air, % by volume, as used by the air-free correction. */
export const O2_IN_AIR_PERCENT = 20.9;

export function coAirFreePpm(coMeasuredPpm: number, o2PercentDry: number): number {
  return (coMeasuredPpm * O2_IN_AIR_PERCENT) / (O2_IN_AIR_PERCENT - o2PercentDry);
}

export const CO_APPLIANCE_TYPES = ['vented_heating', 'unvented_or_residential_water_heater', 'unvented_oven'] as const;
export type CoApplianceType = (typeof CO_APPLIANCE_TYPES)[number];

/** ANSI Z21 air-free CO certification limits, ppm (as quoted by HVAC Today and others). */
export const CO_AIR_FREE_LIMIT_PPM: Record<CoApplianceType, number> = {
  vented_heating: 400,
  unvented_or_residential_water_heater: 200,
  unvented_oven: 800,
};

/** Practitioners' target for gas and oil appliances, ppm air-free (common practice). */
export const CO_AIR_FREE_PRACTICE_TARGET_PPM = 100;

export interface CoCheck {
  limitPpm: number;
  exceedsLimit: boolean;
  exceedsPracticeTarget: boolean;
}

export function checkCoAirFree(coAirFree: number, appliance: CoApplianceType): CoCheck {
  const limitPpm = CO_AIR_FREE_LIMIT_PPM[appliance];
  return { limitPpm, exceedsLimit: coAirFree > limitPpm, exceedsPracticeTarget: coAirFree > CO_AIR_FREE_PRACTICE_TARGET_PPM };
}
