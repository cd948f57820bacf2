/**
 * A fitted baseline model: its coefficients, how to predict use per day with it, and the full
 * fit of one shape at fixed balance points (coefficients with standard errors, t and p).
 */
import { BASE_COUNT, baseAt, parameterCount, slopeCount, type Shape } from './grid';
import type { PeriodTable } from './bill-periods';
import { weightedLeastSquares, type RegressionFailure } from './least-squares';
import { fitQuality, type FitQuality } from './fit-statistics';
import { studentTTwoSidedP } from './student-t';

/** Coefficients of a model; fields that do not apply to the shape are null. */
export interface BaselineModel {
  shape: Shape;
  /** μ, use per day not explained by weather (for `linear`: use per day at 0 °F). */
  intercept: number;
  /** βH, use per HDD (per day). */
  heatingSlope: number | null;
  /** βC, use per CDD (per day). */
  coolingSlope: number | null;
  /** β of the `linear` shape, use per day per °F of period mean temperature. */
  slope: number | null;
  heatingBalanceF: number | null;
  coolingBalanceF: number | null;
}

export type CoefficientName = 'intercept' | 'heatingSlope' | 'coolingSlope' | 'slope';

export interface Coefficient {
  name: CoefficientName;
  estimate: number;
  standardError: number;
  /** null when the standard error is zero (a perfect fit). */
  t: number | null;
  /** Two-sided p-value from Student t with `dfResidual` degrees of freedom. */
  pValue: number;
}

/** A model with its full statistics. */
export interface FittedModel extends BaselineModel {
  coefficients: Coefficient[];
  /** n − c − 1, the degrees of freedom of the standard errors. */
  dfResidual: number;
  quality: FitQuality;
}

/** Degree days of one period at the model's balance points, and its mean temperature. */
export interface PeriodWeather {
  hdd: number;
  cdd: number;
  meanF: number;
}

/** Predicted use per day of a period. */
export function predictUsePerDay(model: BaselineModel, w: PeriodWeather): number {
  return model.intercept + (model.heatingSlope ?? 0) * w.hdd + (model.coolingSlope ?? 0) * w.cdd + (model.slope ?? 0) * w.meanF;
}

function column(table: PeriodTable, dd: Float64Array, k: number): Float64Array {
  const out = new Float64Array(table.n);
  for (let i = 0; i < table.n; i++) out[i] = dd[i * BASE_COUNT + k]!;
  return out;
}

function coefficient(name: CoefficientName, estimate: number, variance: number, df: number): Coefficient {
  const standardError = Math.sqrt(Math.max(0, variance));
  if (!(standardError > 0) || !Number.isFinite(standardError)) {
    return { name, estimate, standardError: 0, t: null, pValue: estimate === 0 ? 1 : 0 };
  }
  const t = estimate / standardError;
  return { name, estimate, standardError, t, pValue: studentTTwoSidedP(t, df) };
}

/**
 * Fit one shape at fixed grid balance points (indices into the 30..90 °F grid; −1 when unused)
 * on the periods of `table`, with full statistics.
 */
export function fitShapeAt(
  table: PeriodTable,
  shape: Shape,
  heatingK: number,
  coolingK: number,
): { ok: true; model: FittedModel; fitted: Float64Array } | { ok: false; reason: RegressionFailure } {
  const y = table.usePerDay.subarray(0, table.n);
  const w = table.days.subarray(0, table.n);
  const columns: Float64Array[] = [];
  const names: CoefficientName[] = ['intercept'];
  if (shape === 'heating' || shape === 'heating-cooling') {
    columns.push(column(table, table.hdd, heatingK));
    names.push('heatingSlope');
  }
  if (shape === 'cooling' || shape === 'heating-cooling') {
    columns.push(column(table, table.cdd, coolingK));
    names.push('coolingSlope');
  }
  if (shape === 'linear') {
    columns.push(table.meanTempF.subarray(0, table.n));
    names.push('slope');
  }
  const fit = weightedLeastSquares(columns, y, w);
  if (!fit.ok) return fit;
  const heatingBalanceF = heatingK >= 0 ? baseAt(heatingK) : null;
  const coolingBalanceF = coolingK >= 0 ? baseAt(coolingK) : null;
  const estimates = [fit.intercept, ...fit.slopes];
  const coefficients = names.map((name, j) => coefficient(name, estimates[j]!, fit.covariance[j]![j]!, fit.dfResidual));
  const value = (name: CoefficientName): number | null => coefficients.find((co) => co.name === name)?.estimate ?? null;
  const model: FittedModel = {
    shape,
    intercept: fit.intercept,
    heatingSlope: value('heatingSlope'),
    coolingSlope: value('coolingSlope'),
    slope: value('slope'),
    heatingBalanceF,
    coolingBalanceF,
    coefficients,
    dfResidual: fit.dfResidual,
    quality: fitQuality(y, fit.fitted, w, slopeCount(shape), parameterCount(shape, heatingBalanceF, coolingBalanceF)),
  };
  return { ok: true, model, fitted: fit.fitted };
}
