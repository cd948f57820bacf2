/**
 * Verified savings of one meter after a measure was implemented: the meter's baseline, fitted on
 * bills before the implementation date, predicts use at the reporting period's actual weather;
 * avoided use = Σ days·(ŷ − y) over the bills after the date (CalTRACK 2.0 §3.6), with the
 * fractional savings uncertainty of CalTRACK 2.0 §4.3.2.4 at 68 % and 90 % confidence — both
 * from the baseline engine (`reportingPeriodSavings`).
 *
 * - The stored baseline is used when its period ends before the implementation date; otherwise
 *   the meter is refitted on the bills that end before the date, over the same window rule as
 *   the portfolio fits (up to `windowDays` ending at the last such bill), with the same shapes.
 * - A bill that spans the implementation date belongs to neither period (the installation
 *   period is left out, as CalTRACK's blackout period).
 * - Caveats are returned, never hidden: fewer than MIN_REPORTING_PERIODS reporting periods, or
 *   a baseline that does not meet its acceptance criteria.
 */
import type { Commodity, Unit } from '../domain';
import type { MeterHeatContent } from '../units/convert';
import {
  BaselineEngine,
  fitOptionsSchema,
  isoDateToDay,
  dayToIsoDate,
  prepareBaselineBills,
  reportingPeriodSavings,
  type Acceptance,
  type AcceptanceThresholds,
  type BaselineBill,
  type DailyTemperatures,
  type FittedModel,
  type ReportingPeriodRow,
  type Shape,
} from '../baseline';

/** Fewer reporting periods than this are shown as too short to judge (common practice: a season). */
export const MIN_REPORTING_PERIODS = 3;
/** Confidence levels shown: about one standard error (68 %) and the 90 % ASHRAE Guideline 14 reports at [memory]. */
export const SAVINGS_CONFIDENCES = [0.68, 0.9] as const;

export interface StoredBaseline {
  periodStart: string | null;
  periodEnd: string | null;
  model: FittedModel | null;
  acceptance: Acceptance | null;
}

export interface VerifiedSavingsInput {
  implementedOn: string;
  bills: readonly BaselineBill[];
  commodity: Commodity;
  unit: Unit;
  heat?: MeterHeatContent | undefined;
  temps: DailyTemperatures;
  stored: StoredBaseline | null;
  shapes: Shape[];
  acceptance: AcceptanceThresholds;
  windowDays: number;
}

export interface SavingsUncertainty {
  confidence: number;
  /** Fractional savings uncertainty (of the savings), or null with the engine's reason. */
  fsu: number | null;
  /** ± avoided use at this confidence. */
  plusMinus: number | null;
  reason: string | null;
}

export type VerifiedCaveat = 'short-reporting-period' | 'baseline-fails-criteria' | 'baseline-insufficient-data';

export type VerifiedSavings =
  | {
      ok: true;
      baseline: {
        source: 'stored' | 'refit';
        periodStart: string;
        periodEnd: string;
        shape: Shape;
        periods: number;
        cvrmse: number | null;
        acceptance: Acceptance;
      };
      reporting: { start: string; end: string; periods: ReportingPeriodRow[]; months: number };
      adjustedBaseline: number;
      reportingUse: number;
      avoidedUse: number;
      savingsFraction: number | null;
      uncertainty: SavingsUncertainty[];
      /** Bills spanning the implementation date, left out. */
      blackoutBills: number;
      caveats: VerifiedCaveat[];
    }
  | { ok: false; reason: 'no-baseline-bills' | 'baseline-failed' | 'no-reporting-bills' | 'no-reporting-periods'; detail: string };

let engine: BaselineEngine | null = null;

/**
 * Verified savings of a meter since `implementedOn`.
 * @returns the avoided use with its uncertainty and caveats, or a typed reason why there is none
 */
export function verifiedSavings(input: VerifiedSavingsInput): VerifiedSavings {
  const impl = isoDateToDay(input.implementedOn);
  if (impl === null) return { ok: false, reason: 'no-baseline-bills', detail: 'the implementation date is not a date' };
  const before = input.bills.filter((b) => b.endDay < impl);
  const after = input.bills.filter((b) => b.startDay >= impl);
  const blackoutBills = input.bills.length - before.length - after.length;
  const prep = { commodity: input.commodity, unit: input.unit, ...(input.heat ? { heat: input.heat } : {}) };

  let model: FittedModel;
  let acceptance: Acceptance;
  let source: 'stored' | 'refit';
  let periodStart: string;
  let periodEnd: string;
  const stored = input.stored;
  const storedEnd = stored?.periodEnd ? isoDateToDay(stored.periodEnd) : null;
  if (stored?.model && stored.acceptance && stored.periodStart && stored.periodEnd && storedEnd !== null && storedEnd < impl) {
    model = stored.model;
    acceptance = stored.acceptance;
    source = 'stored';
    periodStart = stored.periodStart;
    periodEnd = stored.periodEnd;
  } else {
    if (before.length === 0) return { ok: false, reason: 'no-baseline-bills', detail: 'no bill ends before the implementation date' };
    const toDay = Math.max(...before.map((b) => b.endDay));
    const fromDay = toDay - input.windowDays + 1;
    const bills = prepareBaselineBills(before, { ...prep, fromDay, toDay });
    engine ??= new BaselineEngine();
    const fit = engine.fit(bills, input.temps, fitOptionsSchema.parse({ shapes: input.shapes, acceptance: input.acceptance, includePeriods: false, statistics: 'selected' }));
    if (!fit.ok) return { ok: false, reason: 'baseline-failed', detail: `${fit.reason}: ${fit.detail}` };
    model = fit.selected;
    acceptance = fit.acceptance;
    source = 'refit';
    periodStart = fit.periods.firstDay ?? dayToIsoDate(fromDay);
    periodEnd = fit.periods.lastDay ?? dayToIsoDate(toDay);
  }

  if (after.length === 0) return { ok: false, reason: 'no-reporting-bills', detail: 'no bill starts on or after the implementation date yet' };
  const toDay = Math.max(...after.map((b) => b.endDay));
  const reportingBills = prepareBaselineBills(after, { ...prep, fromDay: impl, toDay });
  const runs = SAVINGS_CONFIDENCES.map((confidence) => reportingPeriodSavings(model, reportingBills, input.temps, { confidence }));
  const first = runs[0]!;
  if (!first.ok) return { ok: false, reason: 'no-reporting-periods', detail: first.reason };

  const uncertainty: SavingsUncertainty[] = runs.map((r, i) => {
    const confidence = SAVINGS_CONFIDENCES[i]!;
    if (!r.ok || !r.uncertainty.ok) return { confidence, fsu: null, plusMinus: null, reason: r.ok && !r.uncertainty.ok ? r.uncertainty.reason : 'no-reporting-periods' };
    return { confidence, fsu: r.uncertainty.fsu, plusMinus: r.uncertainty.fsu * Math.abs(r.avoidedUse), reason: null };
  });
  const caveats: VerifiedCaveat[] = [];
  if (first.periods.length < MIN_REPORTING_PERIODS) caveats.push('short-reporting-period');
  if (acceptance.status === 'failing-criteria') caveats.push('baseline-fails-criteria');
  if (acceptance.status === 'insufficient-data') caveats.push('baseline-insufficient-data');
  return {
    ok: true,
    baseline: { source, periodStart, periodEnd, shape: model.shape, periods: model.quality.n, cvrmse: model.quality.cvrmse, acceptance },
    reporting: { start: first.periods[0]!.start, end: first.periods[first.periods.length - 1]!.end, periods: first.periods, months: first.months },
    adjustedBaseline: first.adjustedBaseline,
    reportingUse: first.reportingUse,
    avoidedUse: first.avoidedUse,
    savingsFraction: first.savingsFraction,
    uncertainty,
    blackoutBills,
    caveats,
  };
}
