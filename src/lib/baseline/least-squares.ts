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
  let sw = 0;
  for (let i = 0; i < n; i++) {
    const wi = w === null ? 1 : w[i]!;
    if (!(wi >= 0) || !Number.isFinite(wi) || !Number.isFinite(y[i]!)) return { ok: false, reason: 'invalid-input' };
    for (const c of columns) if (c.length !== n || !Number.isFinite(c[i]!)) return { ok: false, reason: 'invalid-input' };
    sw += wi;
  }
  if (!(sw > 0)) return { ok: false, reason: 'zero-weight' };

  const my = weightedMean(y, w, sw);
  const mx = columns.map((c) => weightedMean(c, w, sw));
  // centred sums: s[a][b] = Σ w (xa − ma)(xb − mb), sy[a] = Σ w (xa − ma)(y − my)
  const s = [
    [0, 0],
    [0, 0],
  ];
  const sy = [0, 0];
  const raw = [0, 0];
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const wi = w === null ? 1 : w[i]!;
    const dy = y[i]! - my;
    syy += wi * dy * dy;
    for (let a = 0; a < k; a++) {
      const da = columns[a]![i]! - mx[a]!;
      raw[a]! += wi * columns[a]![i]! * columns[a]![i]!;
      sy[a]! += wi * da * dy;
      for (let b = a; b < k; b++) s[a]![b]! += wi * da * (columns[b]![i]! - mx[b]!);
    }
  }
  for (let a = 0; a < k; a++) {
    if (!(s[a]![a]! > CONSTANT_TOLERANCE * raw[a]!)) return { ok: false, reason: 'constant-x' };
  }
  // inverse of the centred normal matrix
  let inv: number[][];
  if (k === 0) inv = [];
  else if (k === 1) inv = [[1 / s[0]![0]!]];
  else {
    const a = s[0]![0]!;
    const b = s[0]![1]!;
    const d = s[1]![1]!;
    const det = a * d - b * b;
    if (!(det > COLLINEAR_TOLERANCE * a * d)) return { ok: false, reason: 'collinear' };
    inv = [
      [d / det, -b / det],
      [-b / det, a / det],
    ];
  }
  const slopes: number[] = [];
  for (let a = 0; a < k; a++) {
    let v = 0;
    for (let b = 0; b < k; b++) v += inv[a]![b]! * sy[b]!;
    slopes.push(v);
  }
  let intercept = my;
  for (let a = 0; a < k; a++) intercept -= slopes[a]! * mx[a]!;

  const fitted = new Float64Array(n);
  const residuals = new Float64Array(n);
  let sse = 0;
  for (let i = 0; i < n; i++) {
    // predict from the centred form: ȳ + Σ b (x − m), which keeps residuals accurate
    let f = my;
    for (let a = 0; a < k; a++) f += slopes[a]! * (columns[a]![i]! - mx[a]!);
    fitted[i] = f;
    const e = y[i]! - f;
    residuals[i] = e;
    sse += (w === null ? 1 : w[i]!) * e * e;
  }
  const df = n - k - 1;
  const sigma2 = sse / df;
  // Cov(b) = σ² S⁻¹; Var(b0) = σ² (1/W + mᵀ S⁻¹ m); Cov(b0, b) = −σ² S⁻¹ m
  const covariance: number[][] = Array.from({ length: k + 1 }, () => new Array<number>(k + 1).fill(0));
  let v00 = 1 / sw;
  for (let a = 0; a < k; a++) {
    let sm = 0;
    for (let b = 0; b < k; b++) {
      covariance[a + 1]![b + 1] = sigma2 * inv[a]![b]!;
      sm += inv[a]![b]! * mx[b]!;
    }
    v00 += mx[a]! * sm;
    covariance[0]![a + 1] = -sigma2 * sm;
    covariance[a + 1]![0] = -sigma2 * sm;
  }
  covariance[0]![0] = sigma2 * v00;
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
