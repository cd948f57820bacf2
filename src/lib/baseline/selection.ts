/**
 * Choosing the baseline model among the best candidates of each shape.
 *
 * CalTRACK 2.0 §3.4.3.3 [confirmed]: the qualified candidate with the highest adjusted R²; the
 * mean-only model scores 0 by definition. Ties (within ADJ_R2_TIE, to absorb rounding) go to
 * fewer parameters (GL14 count: intercept, slopes, change points), then to lower balance points
 * (heating first, then cooling). Ties are a house rule [common practice].
 */
import type { Commodity } from '../domain';
import { isHeatingFuel } from '../domain';
import { ALL_SHAPES, type Shape } from './grid';
/** What selection needs to know of a shape's best candidate. */
export interface CandidateScore {
  shape: Shape;
  adjR2: number;
  /** GL14 parameter count: intercept, slopes, change points. */
  parameterCount: number;
  heatingBalanceF: number | null;
  coolingBalanceF: number | null;
}

/** Adjusted R² values closer than this count as equal. */
export const ADJ_R2_TIE = 1e-10;

function lowestBase(m: CandidateScore): number {
  return m.heatingBalanceF ?? m.coolingBalanceF ?? Number.POSITIVE_INFINITY;
}

/**
 * Order two candidates: negative when `a` is preferred.
 * @example [hc, heating, mean].sort(compareCandidates)[0] // the selected candidate
 */
export function compareCandidates(a: CandidateScore, b: CandidateScore): number {
  const da = a.shape === 'mean' ? 0 : a.adjR2;
  const db = b.shape === 'mean' ? 0 : b.adjR2;
  if (Math.abs(da - db) > ADJ_R2_TIE) return db - da;
  const dp = a.parameterCount - b.parameterCount;
  if (dp !== 0) return dp;
  return order(lowestBase(a), lowestBase(b)) || order(a.coolingBalanceF ?? Infinity, b.coolingBalanceF ?? Infinity);
}

function order(x: number, y: number): number {
  return x === y ? 0 : x < y ? -1 : 1;
}

/** The preferred candidate of a non-empty list. */
export function selectScore<T extends CandidateScore>(candidates: readonly T[]): T {
  let best = candidates[0]!;
  for (let i = 1; i < candidates.length; i++) if (compareCandidates(candidates[i]!, best) < 0) best = candidates[i]!;
  return best;
}

/**
 * Shapes worth fitting for a commodity: no cooling degree-day shapes for heating fuels
 * (CalTRACK 2.0 §3.2.1.1 and §3.4.3.1 [confirmed]: no CDD models for gas); every shape otherwise.
 */
export function defaultShapesFor(commodity: Commodity): Shape[] {
  if (isHeatingFuel(commodity)) return ['mean', 'heating', 'linear'];
  return [...ALL_SHAPES];
}
