/**
 * Balance-point search: the best qualified candidate of every shape on the 1 °F grid.
 *
 * With the balance points fixed every shape is linear, so each candidate is a closed-form
 * weighted least-squares problem (CalTRACK 2.0 §3.4.1 [confirmed]: weight = days). Sums are
 * accumulated once per series: centred per-base sums S_hh(b), S_hy(b) (and cooling alike) in
 * one pass, after which each one-slope candidate costs a handful of flops; the two-slope shape
 * is searched in two-slope-search.ts.
 *
 * Qualification (CalTRACK 2.0 §3.4.3.2 [confirmed]): degree-day slopes > 0 and intercept ≥ 0.
 * Within a shape, the best candidate has the smallest weighted residual sum of squares (the same
 * ordering as adjusted R², since c is fixed within a shape); ties go to the lower balance points
 * and, for the two-slope shape, to τH = τC (fewer parameters).
 */
import { BASE_COUNT } from './grid';
import type { PeriodTable } from './bill-periods';
import { searchTwoSlope } from './two-slope-search';
import {
  CONSTANT_TOLERANCE,
  INTERCEPT_TOLERANCE,
  TIE_TOLERANCE,
  resetBest,
  type SearchWorkspace,
  type ShapeBest,
  type ShapeMask,
} from './search-workspace';

/**
 * Centred per-base sums for every base of one degree-day matrix: means m, S_xx = Σ w (x − m)²
 * and S_xy = Σ w (x − m)(y − ȳ). The exact weighted means come with the period table (summed
 * while the degree days were filled), so one pass suffices. Only the non-zero entries are
 * visited (a period has no HDD at bases below its coldest day, no CDD above its warmest); the
 * zero entries contribute m²·(W − W_nz) to S_xx exactly, and nothing to S_xy = Σ w x (y − ȳ)
 * since Σ w (y − ȳ) = 0.
 */
function perBaseSums(t: PeriodTable, heating: boolean, ws: SearchWorkspace): boolean {
  const n = t.n;
  const w = t.days;
  const yc = ws.yc;
  const W = ws.sumWeights;
  const dd = heating ? t.hdd : t.cdd;
  const weighted = heating ? t.weightedHdd : t.weightedCdd;
  const m = heating ? ws.mH : ws.mC;
  const sxx = heating ? ws.shh : ws.scc;
  const sxy = heating ? ws.shy : ws.scy;
  const valid = heating ? ws.validH : ws.validC;
  const wnz = ws.nonZeroWeight;
  for (let k = 0; k < BASE_COUNT; k++) m[k] = weighted[k]! / W;
  sxx.fill(0);
  sxy.fill(0);
  wnz.fill(0);
  for (let i = 0; i < n; i++) {
    const lo = heating ? t.heatingFrom[i]! : 0;
    const hi = heating ? BASE_COUNT - 1 : t.coolingTo[i]!;
    if (lo > hi) continue;
    const wi = w[i]!;
    const wy = wi * yc[i]!;
    // the non-zero range starts (heating) or ends (cooling) here: marked for a running sum below
    wnz[heating ? lo : hi] = wnz[heating ? lo : hi]! + wi;
    const row = i * BASE_COUNT;
    for (let k = lo; k <= hi; k++) {
      const x = dd[row + k]!;
      const d = x - m[k]!;
      sxx[k] = sxx[k]! + wi * d * d;
      sxy[k] = sxy[k]! + wy * x;
    }
  }
  if (heating) for (let k = 1; k < BASE_COUNT; k++) wnz[k] = wnz[k]! + wnz[k - 1]!;
  else for (let k = BASE_COUNT - 2; k >= 0; k--) wnz[k] = wnz[k]! + wnz[k + 1]!;
  let any = false;
  for (let k = 0; k < BASE_COUNT; k++) {
    const mk = m[k]!;
    sxx[k] = sxx[k]! + mk * mk * (W - wnz[k]!);
    const raw = sxx[k]! + W * mk * mk;
    const ok = raw > 0 && sxx[k]! > CONSTANT_TOLERANCE * raw;
    valid[k] = ok ? 1 : 0;
    any ||= ok;
  }
  return any;
}

/** One-slope degree-day shape: best qualified base. */
function searchOneSlope(ws: SearchWorkspace, best: ShapeBest, heating: boolean, muTol: number, tieTol: number): void {
  const m = heating ? ws.mH : ws.mC;
  const sxx = heating ? ws.shh : ws.scc;
  const sxy = heating ? ws.shy : ws.scy;
  const valid = heating ? ws.validH : ws.validC;
  let bestSs = Number.POSITIVE_INFINITY;
  for (let k = 0; k < BASE_COUNT; k++) {
    if (valid[k] === 0) continue;
    best.evaluated++;
    const beta = sxy[k]! / sxx[k]!;
    if (!(beta > 0)) continue;
    if (ws.meanY - beta * m[k]! < -muTol) continue;
    const ss = ws.ssTotal - beta * sxy[k]!;
    if (ss < bestSs - tieTol) {
      bestSs = ss;
      best.found = true;
      best.heatingK = heating ? k : -1;
      best.coolingK = heating ? -1 : k;
    }
  }
  best.ssResidual = best.found ? Math.max(0, bestSs) : 0;
  if (!best.found) best.failure = 'no-qualified-candidate';
}

/** Linear in period mean temperature: closed form, no sign constraint. */
function searchLinear(t: PeriodTable, ws: SearchWorkspace, best: ShapeBest): void {
  const n = t.n;
  const W = ws.sumWeights;
  let mx = 0;
  for (let i = 0; i < n; i++) mx += t.days[i]! * t.meanTempF[i]!;
  mx /= W;
  let sxx = 0;
  let sxy = 0;
  let raw = 0;
  for (let i = 0; i < n; i++) {
    const d = t.meanTempF[i]! - mx;
    sxx += t.days[i]! * d * d;
    sxy += t.days[i]! * d * ws.yc[i]!;
    raw += t.days[i]! * t.meanTempF[i]! * t.meanTempF[i]!;
  }
  best.evaluated = 1;
  if (!(raw > 0 && sxx > CONSTANT_TOLERANCE * raw)) {
    best.failure = 'constant-temperature';
    return;
  }
  best.found = true;
  best.ssResidual = Math.max(0, ws.ssTotal - (sxy * sxy) / sxx);
}

/**
 * Search every requested shape. Fills `ws.heating`, `ws.cooling`, `ws.heatingCooling`,
 * `ws.linear` and the series totals `ws.sumWeights`, `ws.meanY`, `ws.ssTotal`.
 * The caller has checked that the table has ≥ 2 periods and non-zero variance of use per day.
 */
export function searchCandidates(t: PeriodTable, mask: ShapeMask, ws: SearchWorkspace): void {
  const n = t.n;
  if (ws.yc.length < n) ws.yc = new Float64Array(Math.max(n, ws.yc.length * 2));
  let W = 0;
  let sy = 0;
  let yMax = 0;
  for (let i = 0; i < n; i++) {
    W += t.days[i]!;
    sy += t.days[i]! * t.usePerDay[i]!;
    yMax = Math.max(yMax, Math.abs(t.usePerDay[i]!));
  }
  const meanY = sy / W;
  let sst = 0;
  for (let i = 0; i < n; i++) {
    const d = t.usePerDay[i]! - meanY;
    ws.yc[i] = d;
    sst += t.days[i]! * d * d;
  }
  ws.sumWeights = W;
  ws.meanY = meanY;
  ws.ssTotal = sst;
  const muTol = INTERCEPT_TOLERANCE * yMax;
  const tieTol = TIE_TOLERANCE * sst;

  // minimum periods: n − p ≥ 1 so that every statistic (CV(RMSE) with n − p) is defined
  resetBest(ws.heating, mask.heating ? (n >= 4 ? null : 'too-few-periods') : 'not-requested');
  resetBest(ws.cooling, mask.cooling ? (n >= 4 ? null : 'too-few-periods') : 'not-requested');
  resetBest(ws.heatingCooling, mask.heatingCooling ? (n >= 5 ? null : 'too-few-periods') : 'not-requested');
  resetBest(ws.linear, mask.linear ? (n >= 3 ? null : 'too-few-periods') : 'not-requested');

  const wantH = ws.heating.failure === null || ws.heatingCooling.failure === null;
  const wantC = ws.cooling.failure === null || ws.heatingCooling.failure === null;
  const anyH = wantH && perBaseSums(t, true, ws);
  const anyC = wantC && perBaseSums(t, false, ws);
  if (ws.heating.failure === null) {
    if (anyH) searchOneSlope(ws, ws.heating, true, muTol, tieTol);
    else ws.heating.failure = 'no-degree-day-variation';
  }
  if (ws.cooling.failure === null) {
    if (anyC) searchOneSlope(ws, ws.cooling, false, muTol, tieTol);
    else ws.cooling.failure = 'no-degree-day-variation';
  }
  if (ws.heatingCooling.failure === null) {
    if (anyH && anyC) searchTwoSlope(t, ws, ws.heatingCooling, muTol, tieTol);
    else ws.heatingCooling.failure = 'no-degree-day-variation';
  }
  if (ws.linear.failure === null) searchLinear(t, ws, ws.linear);
}
