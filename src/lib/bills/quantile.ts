/**
 * Sample quantiles by linear interpolation between order statistics, Hyndman & Fan (1996)
 * definition 7 (the default of R's `quantile` and of d3-array's `quantileSorted`).
 */

/**
 * Quantile `p` (0-1) of ascending-sorted values: h = (n − 1)·p, x[⌊h⌋] + (h − ⌊h⌋)(x[⌊h⌋+1] − x[⌊h⌋]).
 * @example quantileSorted([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0.25) // 3.25
 * @throws RangeError for an empty input or p outside [0, 1] (programming errors).
 */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0 || !(p >= 0 && p <= 1)) throw new RangeError(`quantileSorted needs values and 0 ≤ p ≤ 1 (n=${n}, p=${p})`);
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const a = sorted[lo] as number;
  return lo + 1 < n ? a + (h - lo) * ((sorted[lo + 1] as number) - a) : a;
}
