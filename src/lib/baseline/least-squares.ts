/**
 * Closed-form weighted least squares with an intercept and up to two predictors.
 *
 * Method: weighted means first, then sums of centred cross products (two-pass), then the 1×1 or
 * 2×2 normal equations of the centred problem solved in closed form; the intercept follows from
 * the means. Centring removes the intercept from the normal equations, which is what keeps
 * well-posed problems such as NIST StRD Norris accurate to 12+ digits.
 * Covariance of the estimates: σ²·(XᵀWX)⁻¹ with σ² = Σ w·e² / (n − k − 1) (standard WLS).
 *
 * Degenerate inputs return a typed reason, never NaN.
 */

export type RegressionFailure = 'too-few-points' | 'invalid-input' | 'zero-weight' | 'constant-x' | 'collinear';

export interface WeightedFit {
  ok: true;
  intercept: number;
  slopes: number[];
  /** Covariance of [intercept, ...slopes]. */
  covariance: number[][];
  fitted: Float64Array;
  residuals: Float64Array;
  /** Σ w (y − ŷ)² */
  ssResidual: number;
  /** Σ w (y − ȳ_w)² */
  ssTotal: number;
  sumWeights: number;
  weightedMeanY: number;
  /** n − k − 1 */
  dfResidual: number;
}

export type WeightedFitResult = WeightedFit | { ok: false; reason: RegressionFailure };

/** Relative size below which a centred sum of squares counts as zero (all x equal). */
const CONSTANT_TOLERANCE = 1e-12;
/** 1 − r² below which two predictors count as collinear. */
const COLLINEAR_TOLERANCE = 1e-10;

function weightedMean(v: ArrayLike<number>, w: ArrayLike<number> | null, sw: number): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += (w === null ? 1 : w[i]!) * v[i]!;
  return s / sw;
}

/**
 * Fit y = b0 + Σ bj·xj by weighted least squares (weights optional; omitted = OLS).
 * @param columns zero, one or two predictor columns, each of y's length
 * @example weightedLeastSquares([[1, 2, 3]], [2, 4, 6]) // { ok: true, intercept: 0, slopes: [2], ... }
 */
export function weightedLeastSquares(
  columns: readonly ArrayLike<number>[],
  y: ArrayLike<number>,
  weights?: ArrayLike<number>,
): WeightedFitResult {
  const n = y.length;
  const k = columns.length;
  if (k > 2) return { ok: false, reason: 'invalid-input' };
  if (n < k + 2) return { ok: false, reason: 'too-few-points' };
  const w = weights ?? null;
  const x0 = k > 0 ? columns[0]! : null;
  const x1 = k > 1 ? columns[1]! : null;
  if ((x0 !== null && x0.length !== n) || (x1 !== null && x1.length !== n)) return { ok: false, reason: 'invalid-input' };
  let sw = 0;
  for (let i = 0; i < n; i++) {
    const wi = w === null ? 1 : w[i]!;
    if (!(wi >= 0) || !Number.isFinite(wi) || !Number.isFinite(y[i]!)) return { ok: false, reason: 'invalid-input' };
    if ((x0 !== null && !Number.isFinite(x0[i]!)) || (x1 !== null && !Number.isFinite(x1[i]!))) return { ok: false, reason: 'invalid-input' };
    sw += wi;
  }
  if (!(sw > 0)) return { ok: false, reason: 'zero-weight' };

  const my = weightedMean(y, w, sw);
  const m0 = x0 === null ? 0 : weightedMean(x0, w, sw);
  const m1 = x1 === null ? 0 : weightedMean(x1, w, sw);
  // centred sums: s00 = Σ w (x0 − m0)², s01, s11; s0y = Σ w (x0 − m0)(y − ȳ), s1y; syy
  let s00 = 0;
  let s01 = 0;
  let s11 = 0;
  let s0y = 0;
  let s1y = 0;
  let syy = 0;
  let raw0 = 0;
  let raw1 = 0;
  for (let i = 0; i < n; i++) {
    const wi = w === null ? 1 : w[i]!;
    const dy = y[i]! - my;
    syy += wi * dy * dy;
    if (x0 !== null) {
      const d0 = x0[i]! - m0;
      raw0 += wi * x0[i]! * x0[i]!;
      s00 += wi * d0 * d0;
      s0y += wi * d0 * dy;
      if (x1 !== null) {
        const d1 = x1[i]! - m1;
        raw1 += wi * x1[i]! * x1[i]!;
        s11 += wi * d1 * d1;
        s01 += wi * d0 * d1;
        s1y += wi * d1 * dy;
      }
    }
  }
  if ((x0 !== null && !(s00 > CONSTANT_TOLERANCE * raw0)) || (x1 !== null && !(s11 > CONSTANT_TOLERANCE * raw1))) {
    return { ok: false, reason: 'constant-x' };
  }
  // inverse of the centred normal matrix [[s00, s01], [s01, s11]] (or its 1×1 / empty case)
  let i00 = 0;
  let i01 = 0;
  let i11 = 0;
  if (k === 1) i00 = 1 / s00;
  else if (k === 2) {
    const det = s00 * s11 - s01 * s01;
    if (!(det > COLLINEAR_TOLERANCE * s00 * s11)) return { ok: false, reason: 'collinear' };
    i00 = s11 / det;
    i01 = -s01 / det;
    i11 = s00 / det;
  }
  const b0 = i00 * s0y + i01 * s1y;
  const b1 = i01 * s0y + i11 * s1y;
  const slopes = k === 0 ? [] : k === 1 ? [b0] : [b0, b1];
  const intercept = my - b0 * m0 - b1 * m1;

  const fitted = new Float64Array(n);
  const residuals = new Float64Array(n);
  let sse = 0;
  for (let i = 0; i < n; i++) {
    // predict from the centred form ȳ + Σ b (x − m), which keeps residuals accurate
    const f = my + (x0 === null ? 0 : b0 * (x0[i]! - m0)) + (x1 === null ? 0 : b1 * (x1[i]! - m1));
    fitted[i] = f;
    const e = y[i]! - f;
    residuals[i] = e;
    sse += (w === null ? 1 : w[i]!) * e * e;
  }
  const df = n - k - 1;
  const sigma2 = sse / df;
  // Cov(b) = σ² S⁻¹; Var(b0) = σ² (1/W + mᵀ S⁻¹ m); Cov(b0, b) = −σ² S⁻¹ m
  const g0 = i00 * m0 + i01 * m1;
  const g1 = i01 * m0 + i11 * m1;
  const v00 = sigma2 * (1 / sw + m0 * g0 + m1 * g1);
  const covariance =
    k === 0
      ? [[v00]]
      : k === 1
        ? [
            [v00, -sigma2 * g0],
            [-sigma2 * g0, sigma2 * i00],
          ]
        : [
            [v00, -sigma2 * g0, -sigma2 * g1],
            [-sigma2 * g0, sigma2 * i00, sigma2 * i01],
            [-sigma2 * g1, sigma2 * i01, sigma2 * i11],
          ];
  return {
    ok: true,
    intercept,
    slopes,
    covariance,
    fitted,
    residuals,
    ssResidual: sse,
    ssTotal: syy,
    sumWeights: sw,
    weightedMeanY: my,
    dfResidual: df,
  };
}
