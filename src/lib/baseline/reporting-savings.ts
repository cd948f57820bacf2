/**
 * Reporting-period savings against a baseline model: predicted use per period, avoided use
 * `Σ_p days_p·(ŷ_p − y_p)` (CalTRACK 2.0 §3.6 [confirmed]: AEU_p = n_p·(ŷ_p − UPD_p)) and the
 * fractional savings uncertainty of CalTRACK 2.0 §4.3.2.4.
 *
 * Reporting bills go through the same period rules as the baseline (shared read dates,
 * ≥ 90 % temperature coverage); dropped bills are reported.
 */
import { BASE_COUNT, BASE_MIN_F } from './grid';
import { PeriodTable, buildPeriodTable, type BillArrays, type DroppedPeriod } from './bill-periods';
import type { DailyTemperatures } from './daily-temperatures';
import { predictUsePerDay, type FittedModel } from './model';
import { fractionalSavingsUncertainty, type FsuResult } from './savings-uncertainty';
import { dayToIsoDate } from './calendar-days';

/** Days per average Gregorian month, to count the months of a reporting period. */
const DAYS_PER_MONTH = 365.2425 / 12;

export interface ReportingPeriodRow {
  start: string;
  end: string;
  days: number;
  actualUse: number;
  predictedUse: number;
  /** days·(ŷ − y): positive when use fell below the baseline. */
  avoidedUse: number;
}

export type ReportingSavings =
  | {
      ok: true;
      periods: ReportingPeriodRow[];
      dropped: DroppedPeriod[];
      /** Σ predicted use (the adjusted baseline). */
      adjustedBaseline: number;
      reportingUse: number;
      avoidedUse: number;
      /** Avoided use / adjusted baseline. */
      savingsFraction: number | null;
      /** Months in the reporting period (days / 30.436875). */
      months: number;
      uncertainty: FsuResult;
    }
  | { ok: false; reason: 'no-reporting-periods' | 'no-baseline-cvrmse'; dropped: DroppedPeriod[] };

/** Grid index of a balance point on the 30..90 °F grid. */
function gridIndex(baseF: number | null): number {
  return baseF === null ? -1 : Math.round(baseF - BASE_MIN_F);
}

/**
 * Avoided use and its fractional uncertainty over the reporting bills.
 * @param confidence two-sided confidence of the FSU (default 0.90)
 */
export function reportingPeriodSavings(
  model: FittedModel,
  bills: BillArrays,
  temps: DailyTemperatures,
  options: { confidence?: number; minTemperatureCoverage?: number } = {},
): ReportingSavings {
  const table = new PeriodTable();
  const dropped = buildPeriodTable(bills, temps, table, options.minTemperatureCoverage ?? 0.9);
  if (table.n === 0) return { ok: false, reason: 'no-reporting-periods', dropped };
  const kh = gridIndex(model.heatingBalanceF);
  const kc = gridIndex(model.coolingBalanceF);
  const periods: ReportingPeriodRow[] = [];
  let adjustedBaseline = 0;
  let reportingUse = 0;
  let days = 0;
  for (let i = 0; i < table.n; i++) {
    const d = table.days[i]!;
    const yhat = predictUsePerDay(model, {
      hdd: kh >= 0 ? table.hdd[i * BASE_COUNT + kh]! : 0,
      cdd: kc >= 0 ? table.cdd[i * BASE_COUNT + kc]! : 0,
      meanF: table.meanTempF[i]!,
    });
    const predictedUse = d * yhat;
    const actualUse = table.quantity[i]!;
    periods.push({ start: dayToIsoDate(table.startDay[i]!), end: dayToIsoDate(table.endDay[i]!), days: d, actualUse, predictedUse, avoidedUse: predictedUse - actualUse });
    adjustedBaseline += predictedUse;
    reportingUse += actualUse;
    days += d;
  }
  const cv = model.quality.cvrmseCaltrack;
  if (cv === null) return { ok: false, reason: 'no-baseline-cvrmse', dropped };
  const avoidedUse = adjustedBaseline - reportingUse;
  const savingsFraction = adjustedBaseline !== 0 ? avoidedUse / adjustedBaseline : null;
  const months = days / DAYS_PER_MONTH;
  const uncertainty: FsuResult =
    savingsFraction === null
      ? { ok: false, reason: 'zero-savings' }
      : fractionalSavingsUncertainty({
          cvrmse: cv,
          baselinePeriods: model.quality.n,
          slopeCount: model.quality.slopeCount,
          rho: model.quality.lag1Autocorrelation,
          reportingPeriods: table.n,
          reportingMonths: months,
          savingsFraction,
          ...(options.confidence !== undefined ? { confidence: options.confidence } : {}),
        });
  return { ok: true, periods, dropped, adjustedBaseline, reportingUse, avoidedUse, savingsFraction, months, uncertainty };
}
