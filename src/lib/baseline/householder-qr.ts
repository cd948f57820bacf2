/**
 * General linear least squares by Householder QR, for validation and for problems with more
 * predictors than the closed-form core handles (e.g. NIST StRD Longley, 6 predictors).
 *
 * Method: Golub & Van Loan, *Matrix Computations*, §5.1–5.3 (Householder reflections, then back
 * substitution on R). Predictors are centred (weighted) when an intercept is fitted and scaled
 * to unit norm before the factorization; both are exact reparametrizations that lower the
 * condition number of ill-conditioned designs such as Longley. Weighted problems scale each row
 * by √w. Covariance: σ²·(RᵀR)⁻¹ mapped back to the original parametrization.
 */

export type QrFailure = 'too-few-points' | 'invalid-input' | 'rank-deficient';

export interface QrFit {
  ok: true;
  /** [intercept, b1, ..., bk] when `intercept` is true, else [b1, ..., bk]. */
  coefficients: number[];
  standardErrors: number[];
  residuals: Float64Array;
  /** Σ w e² */
  ssResidual: number;
  /** Σ w (y − ȳ_w)² (centred) when an intercept is fitted, else Σ w y² */
  ssTotal: number;
  rSquared: number;
  residualStandardDeviation: number;
  dfResidual: number;
}

export type QrFitResult = QrFit | { ok: false; reason: QrFailure };

/** |R_jj| relative to the largest below which the design counts as rank deficient. */
const RANK_TOLERANCE = 1e-12;

/**
 * Least squares y ≈ b0 + X b (or X b without intercept) by Householder QR.
 * @param columns predictor columns, each of y's length
 * @example leastSquaresQr([[1, 2, 3, 4]], [3, 5, 7, 9]).coefficients // [1, 2]
 */
export function leastSquaresQr(
  columns: readonly ArrayLike<number>[],
  y: ArrayLike<number>,
  options: { intercept?: boolean; weights?: ArrayLike<number> } = {},
): QrFitResult {
  const withIntercept = options.intercept ?? true;
  const n = y.length;
  const k = columns.length;
  const p = k + (withIntercept ? 1 : 0);
  if (p === 0 || n <= p) return { ok: false, reason: 'too-few-points' };
  const sw = new Float64Array(n);
  let wsum = 0;
  for (let i = 0; i < n; i++) {
    const wi = options.weights ? options.weights[i]! : 1;
    if (!(wi >= 0) || !Number.isFinite(wi) || !Number.isFinite(y[i]!)) return { ok: false, reason: 'invalid-input' };
    sw[i] = Math.sqrt(wi);
    wsum += wi;
  }
  if (!(wsum > 0)) return { ok: false, reason: 'invalid-input' };
  // design columns after centring and scaling: x'_j = (x_j − m_j) / s_j
  const means = new Float64Array(k);
  const scales = new Float64Array(k);
  const a: Float64Array[] = [];
  if (withIntercept) a.push(Float64Array.from(sw));
  for (let j = 0; j < k; j++) {
    const c = columns[j]!;
    if (c.length !== n) return { ok: false, reason: 'invalid-input' };
    let m = 0;
    if (withIntercept) {
      for (let i = 0; i < n; i++) m += sw[i]! * sw[i]! * c[i]!;
      m /= wsum;
    }
    const col = new Float64Array(n);
    let norm = 0;
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(c[i]!)) return { ok: false, reason: 'invalid-input' };
      col[i] = sw[i]! * (c[i]! - m);
      norm += col[i]! * col[i]!;
    }
    norm = Math.sqrt(norm);
    if (!(norm > 0)) return { ok: false, reason: 'rank-deficient' };
    for (let i = 0; i < n; i++) col[i] = col[i]! / norm;
    means[j] = m;
    scales[j] = norm;
    a.push(col);
  }
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) rhs[i] = sw[i]! * y[i]!;

  // Householder triangularization, applying each reflection to the later columns and to rhs
  const diag = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const aj = a[j]!;
    let norm = 0;
    for (let i = j; i < n; i++) norm += aj[i]! * aj[i]!;
    norm = Math.sqrt(norm);
    if (norm === 0) return { ok: false, reason: 'rank-deficient' };
    const alpha = aj[j]! > 0 ? -norm : norm;
    aj[j] = aj[j]! - alpha; // v = x − alpha·e1, stored in place
    let vnorm2 = 0;
    for (let i = j; i < n; i++) vnorm2 += aj[i]! * aj[i]!;
    diag[j] = alpha;
    const reflect = (target: Float64Array): void => {
      let dot = 0;
      for (let i = j; i < n; i++) dot += aj[i]! * target[i]!;
      const f = (2 * dot) / vnorm2;
      for (let i = j; i < n; i++) target[i] = target[i]! - f * aj[i]!;
    };
    for (let l = j + 1; l < p; l++) reflect(a[l]!);
    reflect(rhs);
  }
  let maxDiag = 0;
  for (let j = 0; j < p; j++) maxDiag = Math.max(maxDiag, Math.abs(diag[j]!));
  for (let j = 0; j < p; j++) if (Math.abs(diag[j]!) <= RANK_TOLERANCE * maxDiag) return { ok: false, reason: 'rank-deficient' };

  // R: R[j][j] = diag[j], R[j][l] = a[l][j] for l > j. Back substitution for R z = (Qᵀ rhs)[0..p)
  const r = (row: number, col: number): number => (row === col ? diag[row]! : a[col]![row]!);
  const z = new Float64Array(p);
  for (let j = p - 1; j >= 0; j--) {
    let v = rhs[j]!;
    for (let l = j + 1; l < p; l++) v -= r(j, l) * z[l]!;
    z[j] = v / diag[j]!;
  }
  let ssr = 0;
  for (let i = p; i < n; i++) ssr += rhs[i]! * rhs[i]!;
  // R⁻¹ (upper triangular), for the covariance (RᵀR)⁻¹ = R⁻¹ R⁻ᵀ
  const rinv = Array.from({ length: p }, () => new Float64Array(p));
  for (let c = 0; c < p; c++) {
    rinv[c]![c] = 1 / diag[c]!;
    for (let row = c - 1; row >= 0; row--) {
      let v = 0;
      for (let l = row + 1; l <= c; l++) v += r(row, l) * rinv[l]![c]!;
      rinv[row]![c] = -v / diag[row]!;
    }
  }
  const df = n - p;
  const sigma2 = ssr / df;
  // covariance in the centred/scaled parametrization
  const cov = Array.from({ length: p }, () => new Float64Array(p));
  for (let i = 0; i < p; i++) {
    for (let j = 0; j < p; j++) {
      let v = 0;
      for (let l = Math.max(i, j); l < p; l++) v += rinv[i]![l]! * rinv[j]![l]!;
      cov[i]![j] = sigma2 * v;
    }
  }
  // map back: b_j = z'_j / s_j; b0 = z0 − Σ b_j m_j (intercept column is √w, i.e. coefficient z0)
  const off = withIntercept ? 1 : 0;
  const coefficients: number[] = [];
  const standardErrors: number[] = [];
  if (withIntercept) {
    let b0 = z[0]!;
    for (let j = 0; j < k; j++) b0 -= (z[j + 1]! / scales[j]!) * means[j]!;
    // Var(b0) = gᵀ cov g with g = [1, −m_1/s_1, ...]
    let v = 0;
    for (let i = 0; i < p; i++) {
      const gi = i === 0 ? 1 : -means[i - 1]! / scales[i - 1]!;
      for (let j = 0; j < p; j++) {
        const gj = j === 0 ? 1 : -means[j - 1]! / scales[j - 1]!;
        v += gi * gj * cov[i]![j]!;
      }
    }
    coefficients.push(b0);
    standardErrors.push(Math.sqrt(Math.max(0, v)));
  }
  for (let j = 0; j < k; j++) {
    coefficients.push(z[j + off]! / scales[j]!);
    standardErrors.push(Math.sqrt(Math.max(0, cov[j + off]![j + off]!)) / scales[j]!);
  }
  const residuals = new Float64Array(n);
  let my = 0;
  for (let i = 0; i < n; i++) my += sw[i]! * sw[i]! * y[i]!;
  my /= wsum;
  let sst = 0;
  for (let i = 0; i < n; i++) {
    let f = withIntercept ? coefficients[0]! : 0;
    for (let j = 0; j < k; j++) f += coefficients[j + off]! * columns[j]![i]!;
    residuals[i] = y[i]! - f;
    const d = withIntercept ? y[i]! - my : y[i]!;
    sst += sw[i]! * sw[i]! * d * d;
  }
  return {
    ok: true,
    coefficients,
    standardErrors,
    residuals,
    ssResidual: ssr,
    ssTotal: sst,
    rSquared: sst > 0 ? 1 - ssr / sst : 0,
    residualStandardDeviation: Math.sqrt(sigma2),
    dfResidual: df,
  };
}
