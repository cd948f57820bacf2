/**
 * Normalized annual consumption (NAC): the use a model predicts for a normal weather year.
 *
 * `NAC = 365·μ + βH·HDD_normal(τH) + βC·CDD_normal(τC)` (PRISM, Fels 1986: NAC concept
 * [confirmed], formula [memory]); the `linear` shape uses the normal-year mean temperature:
 * `NAC = 365·(μ + β·T_normal)`.
 */
import type { BaselineModel } from './model';
import type { NormalYearDegreeDays } from './normal-year';

/** Days in the normalized year (PRISM's 365·μ term). */
const DAYS_PER_NORMAL_YEAR = 365;

export type NacResult = { ok: true; nac: number } | { ok: false; reason: 'invalid-normal-year' };

/**
 * NAC of a model in the units of its bills per year.
 * @example normalizedAnnualConsumption({ shape: 'heating', intercept: 2, heatingSlope: 0.15, ... τH 65 }, normal)
 *          // 365·2 + 0.15·HDD_normal(65)
 */
export function normalizedAnnualConsumption(model: BaselineModel, normal: NormalYearDegreeDays): NacResult {
  let nac = DAYS_PER_NORMAL_YEAR * model.intercept;
  if (model.heatingSlope !== null && model.heatingBalanceF !== null) nac += model.heatingSlope * normal.hdd(model.heatingBalanceF);
  if (model.coolingSlope !== null && model.coolingBalanceF !== null) nac += model.coolingSlope * normal.cdd(model.coolingBalanceF);
  if (model.slope !== null) nac += DAYS_PER_NORMAL_YEAR * model.slope * normal.meanTempF;
  return Number.isFinite(nac) ? { ok: true, nac } : { ok: false, reason: 'invalid-normal-year' };
}
