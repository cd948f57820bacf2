/**
 * Shared state of the balance-point search: reusable buffers, the best candidate of each shape
 * and the numerical tolerances of qualification and ties.
 */
import { BASE_COUNT } from './grid';

/** Why a shape has no candidate. */
export type CandidateFailure =
  | 'not-requested'
  | 'too-few-periods'
  | 'no-degree-day-variation'
  | 'constant-temperature'
  | 'no-qualified-candidate';

/** Best candidate of one shape; indices are grid positions (base = 30 + k °F), −1 when not used. */
export interface ShapeBest {
  found: boolean;
  heatingK: number;
  coolingK: number;
  /** Σ w (y − ŷ)² of the candidate. */
  ssResidual: number;
  /** Candidates fitted (non-degenerate: varying degree days, not collinear). */
  evaluated: number;
  failure: CandidateFailure | null;
}

export interface ShapeMask {
  heating: boolean;
  cooling: boolean;
  heatingCooling: boolean;
  linear: boolean;
}

/** Relative variance below which a degree-day column counts as constant. */
export const CONSTANT_TOLERANCE = 1e-12;
/** 1 − r² below which HDD and CDD columns count as collinear. */
export const COLLINEAR_TOLERANCE = 1e-10;
/** Residual sums within this share of SS_tot count as tied. */
export const TIE_TOLERANCE = 1e-12;
/** Intercepts above −(this × max |y|) count as ≥ 0 (rounding of an exact zero). */
export const INTERCEPT_TOLERANCE = 1e-10;

function emptyBest(): ShapeBest {
  return { found: false, heatingK: -1, coolingK: -1, ssResidual: 0, evaluated: 0, failure: null };
}

/** Reusable buffers for one worker or one thread; not shared across concurrent searches. */
export class SearchWorkspace {
  readonly mH = new Float64Array(BASE_COUNT);
  readonly mC = new Float64Array(BASE_COUNT);
  readonly shh = new Float64Array(BASE_COUNT);
  readonly scc = new Float64Array(BASE_COUNT);
  readonly shy = new Float64Array(BASE_COUNT);
  readonly scy = new Float64Array(BASE_COUNT);
  readonly validH = new Uint8Array(BASE_COUNT);
  readonly validC = new Uint8Array(BASE_COUNT);
  readonly nonZeroWeight = new Float64Array(BASE_COUNT);
  readonly cross = new Float64Array(BASE_COUNT * BASE_COUNT);
  yc = new Float64Array(64);
  sumWeights = 0;
  meanY = 0;
  ssTotal = 0;
  readonly heating = emptyBest();
  readonly cooling = emptyBest();
  readonly heatingCooling = emptyBest();
  readonly linear = emptyBest();
}

export function resetBest(b: ShapeBest, failure: CandidateFailure | null): void {
  b.found = false;
  b.heatingK = -1;
  b.coolingK = -1;
  b.ssResidual = 0;
  b.evaluated = 0;
  b.failure = failure;
}

