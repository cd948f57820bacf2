/**
 * The audit shortlist: candidates scored by ./priority.ts, in rank order, each with the figures
 * the shortlist shows and (optionally only for the top rows) its breakdown.
 */
import type { PriorityCandidate, PriorityOptions } from './priority';
import { scorePriority } from './priority';
import { priorityBreakdown, type PriorityBreakdown } from './priority-breakdown';
import type { PriorityWeights } from './priority-weights';

export interface RankedBuilding<C extends PriorityCandidate = PriorityCandidate> {
  readonly candidate: C;
  /** 1-based, no shared ranks (ties are broken as documented in ./priority.ts). */
  readonly rank: number;
  /** 0–100. */
  readonly score: number;
  /** CBECS 2018 median site EUI used as the peer, kBtu/ft²·yr, and its row label. */
  readonly peerMedian: number;
  readonly peerActivity: string;
  /** Excess over the peer median, kBtu/yr, and its cost, $/yr (null when unpriced). */
  readonly excessKbtu: number;
  readonly excessCost: number | null;
  /** Term rows and sentences; null beyond the top `explainTop` rows. */
  readonly breakdown: PriorityBreakdown | null;
}

export interface RankOptions extends PriorityOptions {
  /**
   * Build breakdowns for this many top rows only (default all). A breakdown is a dozen objects and
   * six sentences kept alive with the result: for 10,000 rows they cost far more than the ranking
   * itself, so a page of the shortlist should ask for the rows it shows
   * (priorityBreakdown gives any other building's on demand).
   */
  readonly explainTop?: number;
}

/**
 * Rank buildings for a walkthrough, best candidate first.
 * @example rankPriority(candidates, DEFAULT_PRIORITY_WEIGHTS, { asOf: '2025-06-30' })[0].rank // 1
 */
export function rankPriority<C extends PriorityCandidate>(
  candidates: readonly C[],
  weights: PriorityWeights,
  options: RankOptions,
): RankedBuilding<C>[] {
  const s = scorePriority(candidates, weights, options);
  const explainTop = options.explainTop ?? s.n;
  const out = new Array<RankedBuilding<C>>(s.n);
  const excess = s.raw[0]!;
  const cost = s.raw[1]!;
  for (let r = 0; r < s.n; r++) {
    const i = s.order[r]!;
    const c = candidates[i]!;
    const peer = s.peers[i]!;
    out[r] = {
      candidate: c,
      rank: r + 1,
      score: s.score[i]!,
      peerMedian: peer.row.median,
      peerActivity: peer.row.activity,
      excessKbtu: excess[i]!,
      excessCost: c.pricePerKbtu === null ? null : cost[i]!,
      breakdown: r < explainTop ? priorityBreakdown(candidates, s, i, options.asOf) : null,
    };
  }
  return out;
}
