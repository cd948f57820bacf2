/**
 * Neumaier's improved Kahan summation (Neumaier 1974, "Rundungsfehleranalyse einiger Verfahren
 * zur Summation endlicher Summen", ZAMM 54): a running sum with a separate error term, so long
 * sums of bill quantities lose no more than one rounding.
 */

/** Adds `x` into slot `i` of (sum, err); the compensated value is sum[i] + err[i]. */
export function addCompensated(sum: Float64Array, err: Float64Array, i: number, x: number): void {
  const s = sum[i] as number;
  const t = s + x;
  err[i] = (err[i] as number) + (Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s);
  sum[i] = t;
}

/** Compensated sum of a list of numbers. */
export function compensatedSum(values: ArrayLike<number>): number {
  const sum = new Float64Array(1);
  const err = new Float64Array(1);
  for (let k = 0; k < values.length; k++) addCompensated(sum, err, 0, values[k] as number);
  return (sum[0] as number) + (err[0] as number);
}
