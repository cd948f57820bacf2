/**
 * Present-value factors of life-cycle cost analysis (NIST Handbook 135; 10 CFR 436 Subpart A),
 * end-of-year convention, d the real discount rate and e the real escalation rate as fractions.
 *
 * - SPV(d, n) = 1 / (1 + d)^n: present value of $1 paid in year n (HB 135 formula D.2.1.1, as cited
 *   in the EnergyPlus engineering reference).
 * - UPV(d, n) = [(1 + d)^n − 1] / [d (1 + d)^n]: present value of $1 a year for n years (the
 *   standard annuity factor (P/A, d, n)).
 * - UPV*(d, e, n) = (1 + e)/(d − e) · [1 − ((1 + e)/(1 + d))^n]: $1 a year in base-year prices that
 *   escalates at e a year [memory for the HB 135 wording; the form follows from summing the series].
 *
 * Computed with expm1/log1p so that small rates keep their digits; d = 0 and d = e give n.
 *
 * @example
 * uniformPresentValue(0.03, 10) // 8.530203
 */

function assertYears(years: number): void {
  if (!Number.isInteger(years) || years < 0) throw new RangeError(`years must be a whole number ≥ 0, got ${years}`);
}

function assertRate(rate: number, name: string): void {
  if (!Number.isFinite(rate) || rate <= -1) throw new RangeError(`${name} must be a finite rate above −100 %, got ${rate}`);
}

/** Single present value factor: 1 / (1 + d)^n. */
export function singlePresentValue(discountRate: number, years: number): number {
  assertRate(discountRate, 'discountRate');
  assertYears(years);
  return Math.exp(-years * Math.log1p(discountRate));
}

/** Uniform present value factor: Σ_{t=1..n} 1/(1 + d)^t. */
export function uniformPresentValue(discountRate: number, years: number): number {
  assertRate(discountRate, 'discountRate');
  assertYears(years);
  if (discountRate === 0) return years;
  return -Math.expm1(-years * Math.log1p(discountRate)) / discountRate;
}

/** Modified uniform present value factor with escalation: Σ_{t=1..n} ((1 + e)/(1 + d))^t. */
export function modifiedUniformPresentValue(discountRate: number, escalationRate: number, years: number): number {
  assertRate(discountRate, 'discountRate');
  assertRate(escalationRate, 'escalationRate');
  assertYears(years);
  if (discountRate === escalationRate) return years;
  // ln((1 + e)/(1 + d)) = log1p((e − d)/(1 + d)), accurate when e is close to d
  const logRatio = Math.log1p((escalationRate - discountRate) / (1 + discountRate));
  return ((1 + escalationRate) / (discountRate - escalationRate)) * -Math.expm1(years * logRatio);
}
