/**
 * Acceptance criteria of a baseline model, with editable thresholds.
 *
 * Defaults: CV(RMSE) ≤ 20 % for energy from monthly data (ASHRAE Guideline 14 whole-building
 * criterion [secondary]); at least 12 periods covering ≥ 365 days (CalTRACK 2.0 §2.2.1.1
 * [confirmed]). The 15 % / 5 % calibrated-simulation limits are not for regression baselines.
 * The engine only says whether a model meets the criteria; accepting it is the analyst's call.
 */
import { z } from 'zod';
import type { FitQuality } from './fit-statistics';

export const acceptanceThresholdsSchema = z.object({
  /** Largest CV(RMSE), GL14 form, as a fraction. */
  maxCvrmse: z.number().positive().default(0.2), // ASHRAE Guideline 14, whole-building energy, monthly data [secondary]
  minPeriods: z.number().int().nonnegative().default(12), // CalTRACK 2.0 §2.2.1.1: a year of bills
  minDays: z.number().nonnegative().default(365), // CalTRACK 2.0 §2.2.1.1: baseline of 365 days
});
export type AcceptanceThresholds = z.infer<typeof acceptanceThresholdsSchema>;

export const DEFAULT_ACCEPTANCE: AcceptanceThresholds = acceptanceThresholdsSchema.parse({});

export type AcceptanceStatus = 'meets-criteria' | 'failing-criteria' | 'insufficient-data';

export interface AcceptanceCheck {
  value: number | null;
  threshold: number;
  pass: boolean;
}

export interface Acceptance {
  status: AcceptanceStatus;
  thresholds: AcceptanceThresholds;
  periods: AcceptanceCheck;
  days: AcceptanceCheck;
  cvrmse: AcceptanceCheck;
}

/**
 * Judge a fit against the thresholds: `insufficient-data` when periods or days fall short,
 * else `failing-criteria` when CV(RMSE) is above the limit or undefined, else `meets-criteria`.
 */
export function assessAcceptance(q: FitQuality, thresholds: AcceptanceThresholds = DEFAULT_ACCEPTANCE): Acceptance {
  const periods = { value: q.n, threshold: thresholds.minPeriods, pass: q.n >= thresholds.minPeriods };
  const days = { value: q.totalDays, threshold: thresholds.minDays, pass: q.totalDays >= thresholds.minDays };
  const cvrmse = { value: q.cvrmse, threshold: thresholds.maxCvrmse, pass: q.cvrmse !== null && q.cvrmse <= thresholds.maxCvrmse };
  const status: AcceptanceStatus = !periods.pass || !days.pass ? 'insufficient-data' : cvrmse.pass ? 'meets-criteria' : 'failing-criteria';
  return { status, thresholds, periods, days, cvrmse };
}
