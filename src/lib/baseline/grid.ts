/**
 * The balance-point grid and the model shapes of the baseline engine.
 *
 * Balance points are searched on every whole °F from 30 to 90 for both heating and cooling
 * degree days (CalTRACK 2.0 §3.2.1.1–2 [confirmed] give the 30–90 °F range; the 1 °F step is
 * finer than CalTRACK's ≤ 3 °F, §3.2.3).
 */
import { z } from 'zod';

/** Lowest candidate balance point, °F (CalTRACK 2.0 §3.2.1). */
export const BASE_MIN_F = 30;
/** Highest candidate balance point, °F (CalTRACK 2.0 §3.2.1). */
export const BASE_MAX_F = 90;
/** Number of candidate balance points on the 1 °F grid (30..90 inclusive). */
export const BASE_COUNT = BASE_MAX_F - BASE_MIN_F + 1;

/** Balance point in °F of grid index `k`. */
export function baseAt(k: number): number {
  return BASE_MIN_F + k;
}

/**
 * Model shapes. `heating-cooling` with equal balance points is the one-change-point,
 * two-slope shape (4P); with τH < τC it is the 5P shape.
 */
export const SHAPES = ['mean', 'heating', 'cooling', 'heating-cooling', 'linear'] as const;
export const shapeSchema = z.enum(SHAPES);
export type Shape = z.infer<typeof shapeSchema>;

/** Shapes fitted when the caller does not restrict them. */
export const ALL_SHAPES: readonly Shape[] = SHAPES;

/**
 * Number of slopes c (explanatory variables excluding the intercept), as used in adjusted R²
 * (CalTRACK 2.0 §3.4.3.3 [confirmed]).
 */
export function slopeCount(shape: Shape): number {
  switch (shape) {
    case 'mean':
      return 0;
    case 'heating':
    case 'cooling':
    case 'linear':
      return 1;
    case 'heating-cooling':
      return 2;
  }
}

/**
 * Number of parameters p in the ASHRAE Guideline 14 sense: intercept, slopes and change points
 * ([memory]: GL14 counts change points, e.g. p = 3 for a 3-parameter model).
 * `heating-cooling` with τH = τC has one change point (4P), otherwise two (5P).
 */
export function parameterCount(shape: Shape, heatingBaseF: number | null, coolingBaseF: number | null): number {
  switch (shape) {
    case 'mean':
      return 1;
    case 'linear':
      return 2;
    case 'heating':
    case 'cooling':
      return 3;
    case 'heating-cooling':
      return heatingBaseF !== null && heatingBaseF === coolingBaseF ? 4 : 5;
  }
}
