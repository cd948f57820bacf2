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
 * score 0. Cost: one sort of the positive values, O(n log n).
 */
import { quantileSorted } from 'simple-statistics';

export const DEFAULT_CAP_PERCENTILE = 0.95;

/**
 * The cap: the `p` quantile of the positive finite values, or 0 when there are none.
 * @example scaleCap(Float64Array.of(0, 1, 2, 3, 4, 100), 0.5) // 3 (median of 1, 2, 3, 4, 100)
 */
export function scaleCap(raw: Float64Array, p: number = DEFAULT_CAP_PERCENTILE): number {
  if (!(p > 0 && p <= 1)) throw new Error(`cap percentile must be in (0, 1]: ${p}`);
  let count = 0;
  for (let i = 0; i < raw.length; i++) if (raw[i]! > 0 && raw[i]! < Infinity) count++;
  if (count === 0) return 0;
  const positives = new Float64Array(count);
  let j = 0;
  for (let i = 0; i < raw.length; i++) {
    const v = raw[i]!;
    if (v > 0 && v < Infinity) positives[j++] = v;
  }
  positives.sort();
  return quantileSorted(positives as unknown as number[], p);
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
