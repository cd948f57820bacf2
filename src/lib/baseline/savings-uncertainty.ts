/**
 * Fractional savings uncertainty (FSU) of a reporting period, CalTRACK 2.0 §4.3.2.4 [confirmed]:
 *
 *   FSU = t · (a·M² + b·M + d) · CV · sqrt( (P/P′) · (1 + 2/P′) · (1/Q) ) / F
 *   P′ = P·(1 − ρ)/(1 + ρ)
 *
 * t: Student t at the two-sided confidence with P − c degrees of freedom; M: months in the
 * reporting period; Q: reporting periods; CV: CalTRACK CV(RMSE) of the baseline (period totals,
 * P − c, a fraction); F: savings fraction (avoided use / adjusted baseline); ρ: lag-1
 * autocorrelation of the baseline residuals. P′ is not defined in the CalTRACK 2.0 text; it is
 * read as ASHRAE Guideline 14's effective number of points n′ ([memory]).
 *
 * Negative ρ: the sources are silent. A negative ρ would make P′ > P and shrink the uncertainty
 * below that of independent residuals; we give no such credit and use ρ = max(ρ, 0), so P′ ≤ P
 * (conservative). `rhoUsed` reports the value applied.
 */
import { studentTQuantile } from './student-t';

/** Sun & Baltazar (2013) coefficients for billing data, as listed in CalTRACK 2.0 §4.3.2.4. */
export const BILLING_FSU_COEFFICIENTS = { a: -0.00022, b: 0.03306, d: 0.94054 } as const;
/** Sun & Baltazar (2013) coefficients for daily data, as listed in CalTRACK 2.0 §4.3.2.4. */
export const DAILY_FSU_COEFFICIENTS = { a: -0.00024, b: 0.03535, d: 1.00286 } as const;

export interface FsuInput {
  /** CalTRACK CV(RMSE) of the baseline, a fraction. */
  cvrmse: number;
  /** P, baseline periods. */
  baselinePeriods: number;
  /** c, slopes of the baseline model. */
  slopeCount: number;
  /** ρ, lag-1 autocorrelation of baseline residuals (null = 0). */
  rho: number | null;
  /** Q, reporting periods. */
  reportingPeriods: number;
  /** M, months in the reporting period. */
  reportingMonths: number;
  /** F = avoided use / adjusted baseline use. */
  savingsFraction: number;
  /** Two-sided confidence level, default 0.90. */
  confidence?: number;
  coefficients?: { a: number; b: number; d: number };
}

export type FsuResult =
  | { ok: true; fsu: number; t: number; effectiveBaselinePeriods: number; rhoUsed: number; polynomial: number; confidence: number }
  | { ok: false; reason: 'zero-savings' | 'too-few-periods' | 'invalid-input' };

/**
 * Fractional savings uncertainty (a fraction of the savings) at the given confidence.
 * @example fractionalSavingsUncertainty({ cvrmse: 0.0214219483284, baselinePeriods: 12, slopeCount: 1, rho: 0,
 *   reportingPeriods: 12, reportingMonths: 12, savingsFraction: 0.1 }).fsu // ≈ 0.15661152
 */
export function fractionalSavingsUncertainty(input: FsuInput): FsuResult {
  const { cvrmse, baselinePeriods: P, slopeCount: c, reportingPeriods: Q, reportingMonths: M, savingsFraction: F } = input;
  const confidence = input.confidence ?? 0.9;
  const k = input.coefficients ?? BILLING_FSU_COEFFICIENTS;
  if (![cvrmse, P, c, Q, M, F, confidence].every(Number.isFinite) || cvrmse < 0 || Q <= 0 || M <= 0 || !(confidence > 0 && confidence < 1)) {
    return { ok: false, reason: 'invalid-input' };
  }
  if (P - c < 1) return { ok: false, reason: 'too-few-periods' };
  if (F === 0) return { ok: false, reason: 'zero-savings' };
  const rho = input.rho ?? 0;
  if (!Number.isFinite(rho) || rho >= 1) return { ok: false, reason: 'invalid-input' };
  const rhoUsed = Math.max(rho, 0);
  const pPrime = (P * (1 - rhoUsed)) / (1 + rhoUsed);
  const t = studentTQuantile(1 - (1 - confidence) / 2, P - c);
  const polynomial = k.a * M * M + k.b * M + k.d;
  const fsu = (t * polynomial * cvrmse * Math.sqrt((P / pPrime) * (1 + 2 / pPrime) * (1 / Q))) / Math.abs(F);
  if (!Number.isFinite(fsu)) return { ok: false, reason: 'invalid-input' };
  return { ok: true, fsu, t, effectiveBaselinePeriods: pPrime, rhoUsed, polynomial, confidence };
}
