/**
 * The baseline engine: bills + daily temperatures → selected weather-normalized model with full
 * statistics, acceptance flags and the best candidate of every shape.
 *
 * Steps (methods.md §2–4): bills to periods (shared read dates, use per day, ≥ 90 % temperature
 * coverage), period degree days at every whole °F 30..90, closed-form candidate search with
 * qualification, selection by adjusted R², then full statistics. One engine instance keeps its
 * buffers between series, so fitting many series allocates little; it is not re-entrant.
 */
import { z } from 'zod';
import { ALL_SHAPES, baseAt, parameterCount, shapeSchema, slopeCount, type Shape } from './grid';
import { PeriodTable, buildPeriodTable, type BillArrays, type DroppedPeriod } from './bill-periods';
import type { DailyTemperatures } from './daily-temperatures';
import { searchCandidates } from './candidate-search';
import { SearchWorkspace, type CandidateFailure, type ShapeBest } from './search-workspace';
import { fitShapeAt, type FittedModel } from './model';
import type { RegressionFailure } from './least-squares';
import { DEFAULT_ACCEPTANCE, acceptanceThresholdsSchema, assessAcceptance, type Acceptance } from './acceptance';
import { STATISTICS_CONVENTIONS } from './fit-statistics';
import { selectScore, type CandidateScore } from './selection';
import { dayToIsoDate } from './calendar-days';

export const fitOptionsSchema = z.object({
  /** Shapes to consider (default: all). E.g. no cooling shapes for gas. */
  shapes: z.array(shapeSchema).min(1).optional(),
  /** Share of a period's days that must have a temperature (CalTRACK 2.0 §2.2.3.2: 0.9). */
  minTemperatureCoverage: z.number().min(0).max(1).default(0.9), // CalTRACK 2.0 §2.2.3.2
  acceptance: acceptanceThresholdsSchema.default(DEFAULT_ACCEPTANCE),
  /** Full statistics for the best candidate of every shape, or for the selected model only. */
  statistics: z.enum(['all-shapes', 'selected']).default('all-shapes'),
  /** Include the per-period table (use per day, temperature, prediction) of the selected model. */
  includePeriods: z.boolean().default(true),
});
export type FitOptionsInput = z.input<typeof fitOptionsSchema>;
export type FitOptions = z.output<typeof fitOptionsSchema>;
export const DEFAULT_FIT_OPTIONS: FitOptions = fitOptionsSchema.parse({});

export type FitFailureReason = 'invalid-input' | 'no-periods' | 'insufficient-temperature' | 'too-few-periods' | 'zero-variance' | 'no-qualified-model';

/** Outcome of one shape: its best qualified candidate, or why there is none. */
export type ShapeOutcome =
  | {
      ok: true;
      shape: Shape;
      heatingBalanceF: number | null;
      coolingBalanceF: number | null;
      adjR2: number;
      /** Non-degenerate candidates fitted on the grid. */
      candidatesEvaluated: number;
      /** Full statistics; null when only the selected model's were requested. */
      model: FittedModel | null;
    }
  | { ok: false; shape: Shape; reason: CandidateFailure | RegressionFailure; candidatesEvaluated: number };

export interface PeriodRow {
  start: string;
  end: string;
  days: number;
  usePerDay: number;
  meanTempF: number;
  predictedUsePerDay: number;
}

export interface PeriodsSummary {
  used: number;
  firstDay: string | null;
  lastDay: string | null;
  dropped: DroppedPeriod[];
  sharedReadDates: number;
  overlaps: number;
  rows: PeriodRow[] | null;
}

export interface BaselineFit {
  ok: true;
  selected: FittedModel;
  acceptance: Acceptance;
  shapes: Record<Shape, ShapeOutcome>;
  periods: PeriodsSummary;
  conventions: typeof STATISTICS_CONVENTIONS;
}

export interface BaselineFailure {
  ok: false;
  reason: FitFailureReason;
  detail: string;
  periods: PeriodsSummary;
}

export type BaselineResult = BaselineFit | BaselineFailure;

/** Use per day whose weighted variance is below this share of Σ w·y² counts as constant. */
const ZERO_VARIANCE_TOLERANCE = 1e-20;

const SEARCH_KEY = { heating: 'heating', cooling: 'cooling', 'heating-cooling': 'heatingCooling', linear: 'linear' } as const;

export class BaselineEngine {
  private readonly table = new PeriodTable();
  private readonly ws = new SearchWorkspace();

  /** Fit one series. `options` must be parsed (see fitOptionsSchema). */
  fit(bills: BillArrays, temps: DailyTemperatures, options: FitOptions = DEFAULT_FIT_OPTIONS): BaselineResult {
    const t = this.table;
    const dropped = buildPeriodTable(bills, temps, t, options.minTemperatureCoverage);
    const periods: PeriodsSummary = {
      used: t.n,
      firstDay: t.n > 0 ? dayToIsoDate(t.startDay[0]!) : null,
      lastDay: t.n > 0 ? dayToIsoDate(t.endDay[t.n - 1]!) : null,
      dropped,
      sharedReadDates: t.sharedReadDates,
      overlaps: t.overlaps,
      rows: null,
    };
    const fail = (reason: FitFailureReason, detail: string): BaselineFailure => ({ ok: false, reason, detail, periods });
    if (t.n === 0) {
      if (dropped.some((d) => d.reason === 'insufficient-temperature')) {
        return fail('insufficient-temperature', 'no period has a temperature on at least the required share of its days');
      }
      return fail('no-periods', 'no usable bill periods');
    }
    if (t.n < 2) return fail('too-few-periods', `${t.n} usable period; at least 2 are needed`);

    const shapes = new Set<Shape>(options.shapes ?? ALL_SHAPES);
    const ws = this.ws;
    searchCandidates(t, { heating: shapes.has('heating'), cooling: shapes.has('cooling'), heatingCooling: shapes.has('heating-cooling'), linear: shapes.has('linear') }, ws);
    let sumWy2 = 0;
    for (let i = 0; i < t.n; i++) sumWy2 += t.days[i]! * t.usePerDay[i]! * t.usePerDay[i]!;
    if (!Number.isFinite(ws.ssTotal) || !Number.isFinite(sumWy2)) return fail('invalid-input', 'use per day too large to fit in double precision');
    if (!(ws.ssTotal > ZERO_VARIANCE_TOLERANCE * sumWy2)) return fail('zero-variance', 'use per day is the same in every period');

    const n = t.n;
    const sst = ws.ssTotal;
    const scores: CandidateScore[] = [];
    if (shapes.has('mean')) scores.push({ shape: 'mean', adjR2: 0, parameterCount: 1, heatingBalanceF: null, coolingBalanceF: null });
    const bests = new Map<Shape, ShapeBest>();
    for (const shape of ['heating', 'cooling', 'heating-cooling', 'linear'] as const) {
      const b = ws[SEARCH_KEY[shape]];
      bests.set(shape, b);
      if (!b.found) continue;
      const hb = b.heatingK >= 0 ? baseAt(b.heatingK) : null;
      const cb = b.coolingK >= 0 ? baseAt(b.coolingK) : null;
      const c = slopeCount(shape);
      scores.push({ shape, adjR2: 1 - b.ssResidual / (n - c - 1) / (sst / (n - 1)), parameterCount: parameterCount(shape, hb, cb), heatingBalanceF: hb, coolingBalanceF: cb });
    }
    if (scores.length === 0) return fail('no-qualified-model', 'no requested shape has a qualified candidate');
    const chosen = selectScore(scores);

    const fitted = new Map<Shape, FittedModel>();
    let selectedFitted: Float64Array | null = null;
    for (const s of scores) {
      if (options.statistics === 'selected' && s !== chosen) continue;
      const b = bests.get(s.shape);
      const r = fitShapeAt(t, s.shape, b?.heatingK ?? -1, b?.coolingK ?? -1);
      if (!r.ok) {
        if (s === chosen) return fail('no-qualified-model', `the selected ${s.shape} model could not be fitted: ${r.reason}`);
        continue;
      }
      fitted.set(s.shape, r.model);
      if (s === chosen) selectedFitted = r.fitted;
    }
    const selected = fitted.get(chosen.shape)!;

    const outcomes = {} as Record<Shape, ShapeOutcome>;
    for (const shape of ALL_SHAPES) {
      const score = scores.find((s) => s.shape === shape);
      const b = bests.get(shape);
      const evaluated = shape === 'mean' ? (shapes.has('mean') ? 1 : 0) : (b?.evaluated ?? 0);
      if (score === undefined) {
        const reason: CandidateFailure = shape === 'mean' ? 'not-requested' : (b?.failure ?? 'not-requested');
        outcomes[shape] = { ok: false, shape, reason, candidatesEvaluated: evaluated };
        continue;
      }
      const model = fitted.get(shape) ?? null;
      outcomes[shape] = {
        ok: true,
        shape,
        heatingBalanceF: score.heatingBalanceF,
        coolingBalanceF: score.coolingBalanceF,
        adjR2: model?.quality.adjR2 ?? score.adjR2,
        candidatesEvaluated: evaluated,
        model,
      };
    }
    if (options.includePeriods && selectedFitted !== null) {
      const rows: PeriodRow[] = [];
      for (let i = 0; i < n; i++) {
        rows.push({
          start: dayToIsoDate(t.startDay[i]!),
          end: dayToIsoDate(t.endDay[i]!),
          days: t.days[i]!,
          usePerDay: t.usePerDay[i]!,
          meanTempF: t.meanTempF[i]!,
          predictedUsePerDay: selectedFitted[i]!,
        });
      }
      periods.rows = rows;
    }
    return {
      ok: true,
      selected,
      acceptance: assessAcceptance(selected.quality, options.acceptance),
      shapes: outcomes,
      periods,
      conventions: STATISTICS_CONVENTIONS,
    };
  }
}
