/**
 * Goodness-of-fit statistics of a weighted least-squares fit on use per day.
 *
 * - R² and adjusted R² on day-weighted sums: `adjR² = 1 − (SS_res/(n−c−1)) / (SS_tot/(n−1))`,
 *   c = slopes (CalTRACK 2.0 §3.4.3.3 [confirmed]).
 * - CV(RMSE) = sqrt(Σ(y−ŷ)²/(n−p)) / ȳ and NMBE = Σ(y−ŷ) / ((n−p)·ȳ), ASHRAE Guideline 14 form
 *   ([memory] for GL14; p counts intercept, slopes and change points), on unweighted use per
 *   day with ȳ its plain mean, as fractions (0.2 = 20 %).
 * - CalTRACK CV(RMSE) = sqrt(Σ(U−Û)²/(P−c)) / Ū on period totals (CalTRACK 2.0 §4.3.2.2
 *   [confirmed]); this is the CV used by the fractional savings uncertainty.
 * - Lag-1 autocorrelation of residuals in time order: r₁ = Σ(e_t−ē)(e_{t−1}−ē) / Σ(e_t−ē)²
 *   (sample autocorrelation, Box & Jenkins).
 * Every field is a finite number or null; nothing is NaN or infinite.
 */

/** How the statistics are defined; stored with every result. */
export const STATISTICS_CONVENTIONS = {
  weights: 'days in the period (CalTRACK 2.0 §3.4.1)',
  rSquared: '1 − SS_res/SS_tot with day-weighted sums',
  adjustedRSquared: '1 − (SS_res/(n−c−1))/(SS_tot/(n−1)), day-weighted, c = number of slopes (CalTRACK 2.0 §3.4.3.3)',
  cvrmse: 'ASHRAE Guideline 14 form: sqrt(Σ(y−ŷ)²/(n−p))/ȳ on use per day, unweighted, p = intercept + slopes + change points; a fraction',
  nmbe: 'ASHRAE Guideline 14 form: Σ(y−ŷ)/((n−p)·ȳ) on use per day, unweighted, residual y − ŷ; a fraction',
  cvrmseCaltrack: 'CalTRACK 2.0 §4.3.2.2: sqrt(Σ(U−Û)²/(P−c))/Ū on period totals; a fraction',
  rmse: 'sqrt(Σ(y−ŷ)²/(n−p)) on use per day',
  standardErrors: 'σ²(XᵀWX)⁻¹ with σ² = Σw(y−ŷ)²/(n−c−1), balance points held fixed; two-sided p from Student t with n−c−1 df',
  lag1Autocorrelation: 'Σ(e_t−ē)(e_{t−1}−ē)/Σ(e_t−ē)² on use-per-day residuals in time order',
  degreeDays: 'CalTRACK 2.0 §3.3.4–5 period averages of daily degree days, over the days with a temperature',
} as const;

export interface FitQuality {
  n: number;
  totalDays: number;
  /** Parameters in the GL14 sense (intercept, slopes, change points). */
  parameterCount: number;
  slopeCount: number;
  r2: number;
  adjR2: number;
  cvrmse: number | null;
  nmbe: number | null;
  cvrmseCaltrack: number | null;
  rmse: number | null;
  /** Σ (y − ŷ)², use per day, unweighted. */
  sse: number;
  /** Σ w (y − ŷ)² */
  sseWeighted: number;
  meanUsePerDay: number;
  lag1Autocorrelation: number | null;
}

/** Lag-1 sample autocorrelation, or null when undefined (n < 3 or constant residuals). */
export function lag1Autocorrelation(e: ArrayLike<number>): number | null {
  const n = e.length;
  if (n < 3) return null;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += e[i]!;
  mean /= n;
  let num = 0;
  let den = 0;
  for (let i = 0; i < n; i++) {
    const d = e[i]! - mean;
    den += d * d;
    if (i > 0) num += d * (e[i - 1]! - mean);
  }
  if (!(den > 0)) return null;
  const r = num / den;
  return Number.isFinite(r) ? r : null;
}

/**
 * Statistics of a fit from its observations, fitted values and weights (days).
 * @param y use per day in time order; `fitted` ŷ; `days` the weights
 * @param c number of slopes; `p` GL14 parameter count
 */
export function fitQuality(
  y: ArrayLike<number>,
  fitted: ArrayLike<number>,
  days: ArrayLike<number>,
  c: number,
  p: number,
): FitQuality {
  const n = y.length;
  let W = 0;
  let swy = 0;
  let sy = 0;
  let totals = 0;
  for (let i = 0; i < n; i++) {
    W += days[i]!;
    swy += days[i]! * y[i]!;
    sy += y[i]!;
    totals += days[i]! * y[i]!;
  }
  const meanW = W > 0 ? swy / W : 0;
  const meanY = n > 0 ? sy / n : 0;
  const meanTotal = n > 0 ? totals / n : 0;
  let sst = 0;
  let ssw = 0;
  let sse = 0;
  let sumE = 0;
  let sseTotals = 0;
  const e = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = y[i]! - fitted[i]!;
    e[i] = r;
    const d = y[i]! - meanW;
    sst += days[i]! * d * d;
    ssw += days[i]! * r * r;
    sse += r * r;
    sumE += r;
    sseTotals += days[i]! * r * days[i]! * r;
  }
  const dfP = n - p;
  const dfAdj = n - c - 1;
  const r2 = sst > 0 ? 1 - ssw / sst : 0;
  const adjR2 = sst > 0 && dfAdj > 0 && n > 1 ? 1 - ssw / dfAdj / (sst / (n - 1)) : 0;
  const rmse = dfP > 0 ? Math.sqrt(sse / dfP) : null;
  const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);
  return {
    n,
    totalDays: W,
    parameterCount: p,
    slopeCount: c,
    r2,
    adjR2,
    cvrmse: rmse !== null && meanY > 0 ? finite(rmse / meanY) : null,
    nmbe: dfP > 0 && meanY > 0 ? finite(sumE / (dfP * meanY)) : null,
    cvrmseCaltrack: n - c > 0 && meanTotal > 0 ? finite(Math.sqrt(sseTotals / (n - c)) / meanTotal) : null,
    rmse,
    sse,
    sseWeighted: ssw,
    meanUsePerDay: meanY,
    lag1Autocorrelation: lag1Autocorrelation(e),
  };
}
