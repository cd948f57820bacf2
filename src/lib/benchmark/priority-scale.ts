/**
 * Scaling of an audit-priority term to 0–1 across the candidate set.
 *
 * Method (a project decision): divide each raw value by a cap and clip to [0, 1], where the cap is
 * a high percentile (default the 95th, linear interpolation, Hyndman & Fan type 7 as in R's
 * default and simple-statistics' quantileSorted) of the candidates' **positive** raw values.
 * - Dividing (rather than min–max) keeps zero meaning "nothing to find": a building at or below
 *   its peer median scores 0 on that term whatever the others do.
 * - Capping at a percentile rather than the maximum keeps one extreme building (a meter error, a
 *   data center) from squeezing everyone else towards 0; everything at or above the cap scores 1.
 * - Only positive values enter the percentile: most buildings sit at 0 on excess and trend terms,
 *   and including them would pull the cap down to 0.
 * With no positive value the term scores 0 for everyone. Negative and non-finite raw values
 * score 0. Cost: one selection over the positive values, O(n) on average.
 */
export const DEFAULT_CAP_PERCENTILE = 0.95;

/**
 * k-th smallest element (0-based) of `a[lo..hi]`, rearranging `a` in place: Hoare's selection
 * algorithm (C. A. R. Hoare, "Algorithm 65: FIND", CACM 1961) with a median-of-three pivot.
 * Afterwards a[k] holds the answer, everything before it is ≤ and everything after it ≥.
 */
function select(a: Float64Array, k: number): number {
  let lo = 0;
  let hi = a.length - 1;
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // Median of three into a[mid], then use it as the pivot.
    if (a[mid]! < a[lo]!) swap(a, mid, lo);
    if (a[hi]! < a[lo]!) swap(a, hi, lo);
    if (a[hi]! < a[mid]!) swap(a, hi, mid);
    const pivot = a[mid]!;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        swap(a, i, j);
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k]!;
  }
  return a[k]!;
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i]!;
  a[i] = a[j]!;
  a[j] = t;
}

/**
 * The cap: the `p` quantile (type 7) of the positive finite values, or 0 when there are none.
 * Found by selection rather than sorting, O(n) on average.
 * @example scaleCap(Float64Array.of(0, 1, 2, 3, 4, 100), 0.5) // 3 (median of 1, 2, 3, 4, 100)
 */
export function scaleCap(raw: Float64Array, p: number = DEFAULT_CAP_PERCENTILE): number {
  if (!(p > 0 && p <= 1)) throw new Error(`cap percentile must be in (0, 1]: ${p}`);
  const positives = new Float64Array(raw.length);
  let count = 0;
  for (let i = 0; i < raw.length; i++) {
    const v = raw[i]!;
    if (v > 0 && v < Infinity) positives[count++] = v;
  }
  if (count === 0) return 0;
  const a = positives.subarray(0, count);
  // Type 7: h = (n − 1)p; x[⌊h⌋] + (h − ⌊h⌋)(x[⌊h⌋ + 1] − x[⌊h⌋]) on the sorted values.
  const h = (count - 1) * p;
  const k = Math.floor(h);
  const lower = select(a, k);
  if (h === k) return lower;
  let upper = Infinity; // the next order statistic: the smallest value after position k
  for (let i = k + 1; i < count; i++) if (a[i]! < upper) upper = a[i]!;
  return lower + (h - k) * (upper - lower);
}

/** One raw value scaled by a cap: min(1, max(0, v) / cap); 0 when the cap is 0 or v not finite. */
export function scaleValue(v: number, cap: number): number {
  if (!(cap > 0) || !(v > 0)) return 0;
  return v >= cap ? 1 : v / cap;
}

/**
 * Scale every raw value into `out` (allocated when absent) and return the cap used.
 * @example
 * const out = new Float64Array(3); scaleTerm(Float64Array.of(0, 5, 10), out, 1) // cap 10; out = [0, 0.5, 1]
 */
export function scaleTerm(
  raw: Float64Array,
  out: Float64Array,
  p: number = DEFAULT_CAP_PERCENTILE,
): number {
  const cap = scaleCap(raw, p);
  for (let i = 0; i < raw.length; i++) out[i] = scaleValue(raw[i]!, cap);
  return cap;
}
