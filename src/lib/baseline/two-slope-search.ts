/**
 * The two-slope (heating-and-cooling) part of the balance-point search: every (τH ≤ τC) pair
 * on the 1 °F grid, τH = τC being the one-change-point shape.
 *
 * Cross sums S_hc(bH, bC) = Σ w·H·C − W·m_H·m_C. The raw product H_p(bH)·C_p(bC) of a period is
 * non-zero only when the period has a day colder than bH and a day warmer than bC, so Σ w·H·C
 * is accumulated per period over that triangle only (shoulder months). Each pair is then a 2×2
 * solve with early rejection: the signs of the slopes are checked before any division, and the
 * intercept only for a pair that would improve on the best so far.
 */
import { BASE_COUNT } from './grid';
import type { PeriodTable } from './bill-periods';
import { COLLINEAR_TOLERANCE, type SearchWorkspace, type ShapeBest } from './search-workspace';

/** Σ w·H_p(bH)·C_p(bC) over the periods where both are non-zero, for every bH ≤ bC. */
function accumulateCross(t: PeriodTable, ws: SearchWorkspace): void {
  const cross = ws.cross;
  cross.fill(0);
  const { hdd, cdd, days, heatingFrom, coolingTo } = t;
  for (let i = 0; i < t.n; i++) {
    // H_p(30 + k) > 0 iff k ≥ heatingFrom (a colder day exists); C_p(30 + k) > 0 iff k ≤ coolingTo
    const lo = heatingFrom[i]!;
    const hi = coolingTo[i]!;
    if (lo > hi) continue;
    const row = i * BASE_COUNT;
    const wi = days[i]!;
    for (let kh = lo; kh <= hi; kh++) {
      const hv = wi * hdd[row + kh]!;
      // axpy over the row segment kc = kh..hi, unrolled by four (short rows; loop overhead matters)
      let p = kh * BASE_COUNT + kh;
      let q = row + kh;
      const end = row + hi;
      for (; q + 3 <= end; q += 4, p += 4) {
        cross[p] = cross[p]! + hv * cdd[q]!;
        cross[p + 1] = cross[p + 1]! + hv * cdd[q + 1]!;
        cross[p + 2] = cross[p + 2]! + hv * cdd[q + 2]!;
        cross[p + 3] = cross[p + 3]! + hv * cdd[q + 3]!;
      }
      for (; q <= end; q++, p++) cross[p] = cross[p]! + hv * cdd[q]!;
    }
  }
}

/** Best qualified (τH ≤ τC) pair, into `best`. */
export function searchTwoSlope(t: PeriodTable, ws: SearchWorkspace, best: ShapeBest, muTol: number, tieTol: number): void {
  accumulateCross(t, ws);
  const { mH, mC, shh, scc, shy, scy, validH, validC, cross } = ws;
  const W = ws.sumWeights;
  const meanY = ws.meanY;
  const sst = ws.ssTotal;
  let bestSs = Number.POSITIVE_INFINITY;
  let bestH = -1;
  let bestC = -1;
  let evaluated = 0;
  // τH < τC has 5 parameters and needs n ≥ 6; τH = τC has 4 and needs n ≥ 5
  const twoChangePoints = t.n >= 6;
  for (let kh = 0; kh < BASE_COUNT; kh++) {
    if (validH[kh] === 0) continue;
    const kcEnd = twoChangePoints ? BASE_COUNT : kh + 1;
    const a = shh[kh]!;
    const hy = shy[kh]!;
    const mh = mH[kh]!;
    const wmh = W * mh;
    const row = kh * BASE_COUNT;
    for (let kc = kh; kc < kcEnd; kc++) {
      if (validC[kc] === 0) continue;
      const d = scc[kc]!;
      const b = cross[row + kc]! - wmh * mC[kc]!;
      const det = a * d - b * b;
      if (!(det > COLLINEAR_TOLERANCE * a * d)) continue;
      evaluated++;
      const cy = scy[kc]!;
      // slopes times det: βH·det = d·S_hy − b·S_cy, βC·det = a·S_cy − b·S_hy (det > 0)
      const nh = d * hy - b * cy;
      if (!(nh > 0)) continue;
      const nc = a * cy - b * hy;
      if (!(nc > 0)) continue;
      // SS_res = SST − (nh·S_hy + nc·S_cy)/det: compare without dividing, then check the intercept
      const gain = nh * hy + nc * cy;
      const better = gain > (sst - bestSs + tieTol) * det;
      const tiedFewer = !better && kh === kc && bestH !== bestC && gain >= (sst - bestSs - tieTol) * det;
      if (!better && !tiedFewer) continue;
      if (meanY * det - nh * mh - nc * mC[kc]! < -muTol * det) continue;
      bestSs = sst - gain / det;
      bestH = kh;
      bestC = kc;
    }
  }
  best.evaluated = evaluated;
  if (bestH >= 0) {
    best.found = true;
    best.heatingK = bestH;
    best.coolingK = bestC;
    best.ssResidual = Math.max(0, bestSs);
  } else {
    best.failure = evaluated === 0 ? 'no-degree-day-variation' : 'no-qualified-candidate';
  }
}

