/**
 * Audit priority: a 0–100 score per building and a ranked shortlist (methods §5).
 *
 * Terms (raw value, unit → scaling):
 * 1. excessEnergy  max(0, EUI_norm − peer median) × area, kBtu/yr → robust cap (./priority-scale.ts)
 * 2. excessCost    excessEnergy × blended $/kBtu from the building's own bills, $/yr → robust cap
 * 3. yoyIncrease   max(0, (normalized use now − a year before) / a year before), fraction → cap
 *                  (0 without a positive previous year)
 * 4. anomalies     count of recent bill periods whose residual exceeds 2 standard errors → cap
 * 5. evaluationAge years since the last comprehensive evaluation → min(1, years / 4); never → 1
 *                  (four-year cycle: 42 U.S.C. 8253(f)(3), added by EISA 2007 §432)
 * 6. manualFlag    0 or 1, as is
 * score = 100 · Σ wᵢ·sᵢ / Σ wᵢ. Order: score desc, then excess kBtu desc, then building number
 * ascending (numeric-aware, 'en' collation), then building id: a total order, so equal inputs
 * always rank the same way. Work is O(n log n) with typed arrays; no per-term objects are made
 * here (./priority-breakdown.ts builds the breakdown).
 */
import { z } from 'zod';
import { useTypeSchema } from '../domain';
import { nationalPeer, type NationalPeer } from './peers';
import { DEFAULT_CAP_PERCENTILE, scaleTerm } from './priority-scale';
import { normalizeWeights, PRIORITY_TERMS, type PriorityWeights } from './priority-weights';
import { isoDateSchema } from './windows';

/** Years in the evaluation cycle (42 U.S.C. 8253(f)(3), EISA 2007 §432). */
export const EVALUATION_CYCLE_YEARS = 4;
const DAYS_PER_YEAR = 365.25;

export const priorityCandidateSchema = z.object({
  buildingId: z.string().min(1),
  buildingNumber: z.string(),
  useType: useTypeSchema,
  /** A Table C12 row label that replaces the use type's mapping (see ./peers.ts). */
  cbecsOverride: z.string().nullish(),
  areaFt2: z.number().positive(),
  /** Weather-normalized EUI, kBtu/ft²·yr; null when no accepted baseline. */
  euiNormalized: z.number().nullable(),
  /** Blended energy price from the building's bills, $/kBtu. */
  pricePerKbtu: z.number().min(0).nullable(),
  /** Normalized annual use this year and a year before, kBtu (same basis for both). */
  yoy: z.object({ current: z.number(), previous: z.number() }).nullable(),
  /** Recent bill periods tested against the baseline, and how many fell beyond 2 SE. */
  anomalies: z
    .object({
      recentPeriods: z.number().int().min(0),
      beyond2Se: z.number().int().min(0),
      largestSe: z.number().nullish(),
    })
    .nullable(),
  /** Date of the last comprehensive energy and water evaluation; null when never. */
  lastEvaluated: isoDateSchema.nullable(),
  manualFlag: z.boolean(),
  flagReason: z.string().nullish(),
});
export type PriorityCandidate = z.infer<typeof priorityCandidateSchema>;

export interface PriorityOptions {
  /** Date the evaluation age is measured to ('YYYY-MM-DD'). */
  readonly asOf: string;
  /** Percentile of positive raw values used as the scaling cap; default 0.95. */
  readonly capPercentile?: number;
}

/** Numeric core of a ranking: term-major raw and scaled matrices, scores and the order. */
export interface PriorityScores {
  readonly n: number;
  /** raw[t][i], scaled[t][i] for term t in PRIORITY_TERMS order. */
  readonly raw: readonly Float64Array[];
  readonly scaled: readonly Float64Array[];
  /** Normalized weights in PRIORITY_TERMS order (sum 1). */
  readonly weights: Float64Array;
  /** Caps used for terms scaled across the set (0 for fixed-scale terms). */
  readonly caps: Float64Array;
  readonly score: Float64Array;
  /** Candidate indices, best first. */
  readonly order: Int32Array;
  /** rank[i] = 1-based rank of candidate i. */
  readonly rank: Int32Array;
  readonly peers: readonly NationalPeer[];
}

const COLLATOR = new Intl.Collator('en', { numeric: true });

/**
 * Day number of a 'YYYY-MM-DD' date (days since 1970-01-01, proleptic Gregorian), by integer
 * arithmetic: the days-from-civil algorithm of H. Hinnant, "chrono-Compatible Low-Level Date
 * Algorithms". The date was validated by the schema at the boundary.
 */
function dayNumber(iso: string): number {
  // No helper closure here: this runs once per candidate.
  let y =
    (iso.charCodeAt(0) - 48) * 1000 +
    (iso.charCodeAt(1) - 48) * 100 +
    (iso.charCodeAt(2) - 48) * 10 +
    (iso.charCodeAt(3) - 48);
  const m = (iso.charCodeAt(5) - 48) * 10 + (iso.charCodeAt(6) - 48);
  const d = (iso.charCodeAt(8) - 48) * 10 + (iso.charCodeAt(9) - 48);
  y -= m <= 2 ? 1 : 0;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468;
}

/**
 * Score and order candidates. Indices in the result refer to `candidates`.
 * @example scorePriority(cands, DEFAULT_PRIORITY_WEIGHTS, { asOf: '2025-06-30' }).order[0]
 */
export function scorePriority(
  candidates: readonly PriorityCandidate[],
  weights: PriorityWeights,
  options: PriorityOptions,
): PriorityScores {
  const n = candidates.length;
  const T = PRIORITY_TERMS.length;
  const raw = Array.from({ length: T }, () => new Float64Array(n));
  const scaled = Array.from({ length: T }, () => new Float64Array(n));
  const [rExcess, rCost, rYoy, rAnom, rEval, rFlag] = raw as [
    Float64Array,
    Float64Array,
    Float64Array,
    Float64Array,
    Float64Array,
    Float64Array,
  ];
  // Peers by use type, plus a cache for the rare overrides: no allocation on the common path.
  const byUseType = new Map<string, NationalPeer>();
  const byOverride = new Map<string, NationalPeer>();
  const peers: NationalPeer[] = new Array<NationalPeer>(n);
  const asOfDay = dayNumber(options.asOf);

  for (let i = 0; i < n; i++) {
    const c = candidates[i]!;
    const cache = c.cbecsOverride ? byOverride : byUseType;
    const key = c.cbecsOverride ? `${c.useType}|${c.cbecsOverride}` : c.useType;
    let peer = cache.get(key);
    if (!peer) {
      peer = nationalPeer(c.useType, c.cbecsOverride);
      cache.set(key, peer);
    }
    peers[i] = peer;
    const excess =
      c.euiNormalized === null ? 0 : Math.max(0, c.euiNormalized - peer.row.median) * c.areaFt2;
    rExcess[i] = excess;
    rCost[i] = c.pricePerKbtu === null ? 0 : excess * c.pricePerKbtu;
    rYoy[i] =
      c.yoy !== null && c.yoy.previous > 0
        ? Math.max(0, (c.yoy.current - c.yoy.previous) / c.yoy.previous)
        : 0;
    rAnom[i] = c.anomalies?.beyond2Se ?? 0;
    rEval[i] =
      c.lastEvaluated === null
        ? Infinity
        : Math.max(0, asOfDay - dayNumber(c.lastEvaluated)) / DAYS_PER_YEAR;
    rFlag[i] = c.manualFlag ? 1 : 0;
  }

  const p = options.capPercentile ?? DEFAULT_CAP_PERCENTILE;
  const caps = new Float64Array(T);
  for (let t = 0; t < 4; t++) caps[t] = scaleTerm(raw[t]!, scaled[t]!, p);
  const sEval = scaled[4]!;
  const sFlag = scaled[5]!;
  for (let i = 0; i < n; i++) {
    sEval[i] = Math.min(1, rEval[i]! / EVALUATION_CYCLE_YEARS);
    sFlag[i] = rFlag[i]!;
  }

  const w = normalizeWeights(weights);
  const score = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let t = 0; t < T; t++) s += w[t]! * scaled[t]![i]!;
    score[i] = 100 * s;
  }

  // A plain array sorts with a comparator faster than a typed array in V8; copied afterwards.
  const idx = new Array<number>(n);
  for (let i = 0; i < n; i++) idx[i] = i;
  idx.sort((a, b) => {
    const ds = score[b]! - score[a]!;
    if (ds !== 0) return ds;
    const de = rExcess[b]! - rExcess[a]!;
    if (de !== 0) return de;
    const ca = candidates[a]!;
    const cb = candidates[b]!;
    const dn = COLLATOR.compare(ca.buildingNumber, cb.buildingNumber);
    if (dn !== 0) return dn;
    return ca.buildingId < cb.buildingId ? -1 : ca.buildingId > cb.buildingId ? 1 : a - b;
  });
  const order = Int32Array.from(idx);
  const rank = new Int32Array(n);
  for (let r = 0; r < n; r++) rank[order[r]!] = r + 1;

  return { n, raw, scaled, weights: w, caps, score, order, rank, peers };
}
