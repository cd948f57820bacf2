/**
 * The per-building breakdown of an audit-priority score: each term's raw value with its unit, its
 * 0–1 scaled value, its weight and the points it adds, and plain-English sentences that explain
 * the rank, biggest contribution first.
 */
import { formatNumber, formatPercent } from '../format';
import type { NationalPeer } from './peers';
import type { PriorityCandidate, PriorityScores } from './priority';
import { EVALUATION_CYCLE_YEARS } from './priority';
import { PRIORITY_TERM_LABELS, PRIORITY_TERMS, type PriorityTerm } from './priority-weights';

export type TermUnit = 'kBtu/yr' | '$/yr' | 'fraction' | 'periods' | 'years' | 'flag';

const TERM_UNITS: Readonly<Record<PriorityTerm, TermUnit>> = {
  excessEnergy: 'kBtu/yr',
  excessCost: '$/yr',
  yoyIncrease: 'fraction',
  anomalies: 'periods',
  evaluationAge: 'years',
  manualFlag: 'flag',
};

export interface TermBreakdown {
  readonly term: PriorityTerm;
  readonly label: string;
  /** Raw value in `unit`; null when the input was missing (no baseline, never evaluated, …). */
  readonly raw: number | null;
  readonly unit: TermUnit;
  /** 0–1. */
  readonly scaled: number;
  /** Share of the total weight, 0–1. */
  readonly weight: number;
  /** Points this term adds to the 0–100 score: 100 · weight · scaled. */
  readonly points: number;
}

export interface PriorityBreakdown {
  readonly terms: readonly TermBreakdown[];
  /** Sentences, the largest contribution first. */
  readonly explanation: readonly string[];
}

/** "62 %", one decimal below 10 % (display convention of ../format.ts). */
function pct(fraction: number): string {
  const p = Math.abs(fraction);
  return formatPercent(p, p < 0.1 ? 1 : 0);
}

/** "the median office building (CBECS 2018)"; says so when the comparison fell back. */
function peerPhrase(peer: NationalPeer): string {
  if (peer.row.activity === 'All buildings') {
    const why = peer.match === 'all-buildings' ? ', no closer CBECS row' : '';
    return `the median U.S. commercial building (CBECS 2018, all buildings${why})`;
  }
  const fellBack = peer.match === 'parent' ? `, ${peer.requested ?? ''} withheld by EIA` : '';
  return `the median ${peer.row.activity.toLowerCase()} building (CBECS 2018${fellBack})`;
}

function sentence(
  term: PriorityTerm,
  c: PriorityCandidate,
  raw: number,
  peer: NationalPeer,
  asOf: string,
): string {
  switch (term) {
    case 'excessEnergy': {
      if (c.euiNormalized === null)
        return 'No weather-normalized EUI yet, so no excess over peers is counted.';
      const m = peer.row.median;
      const rel = m > 0 ? (c.euiNormalized - m) / m : 0;
      const vs = `${formatNumber(c.euiNormalized, 1)} vs ${formatNumber(m, 1)} kBtu/ft²·yr`;
      return rel > 0
        ? `Uses ${pct(rel)} more energy per square foot than ${peerPhrase(peer)}: ${vs}, about ${formatNumber(raw)} kBtu a year above the median.`
        : `Uses ${pct(rel)} less energy per square foot than ${peerPhrase(peer)}: ${vs}, no excess.`;
    }
    case 'excessCost':
      if (c.pricePerKbtu === null)
        return 'No energy cost on its bills, so the excess cannot be priced.';
      if (raw === 0) return 'No excess energy to price.';
      return `At $${c.pricePerKbtu.toFixed(4)}/kBtu from its own bills, the excess costs about $${formatNumber(raw)} a year.`;
    case 'yoyIncrease': {
      if (c.yoy === null || !(c.yoy.previous > 0))
        return 'Not enough history for a year-over-year comparison.';
      const rel = (c.yoy.current - c.yoy.previous) / c.yoy.previous;
      return rel > 0
        ? `Weather-normalized use rose ${pct(rel)} over the previous year.`
        : `Weather-normalized use ${rel < 0 ? `fell ${pct(rel)}` : 'did not change'} from the previous year.`;
    }
    case 'anomalies': {
      const a = c.anomalies;
      if (a === null) return 'No accepted baseline to test recent bills against.';
      if (a.beyond2Se === 0)
        return `None of the last ${a.recentPeriods} bills is more than 2 standard errors from the baseline.`;
      const largest = a.largestSe != null ? ` (largest ${formatNumber(a.largestSe, 1)})` : '';
      return `${a.beyond2Se} of the last ${a.recentPeriods} bills were more than 2 standard errors from the baseline${largest}.`;
    }
    case 'evaluationAge': {
      const cycle = `the evaluation cycle is ${EVALUATION_CYCLE_YEARS} years (EISA 2007 §432)`;
      if (c.lastEvaluated === null) return `No evaluation on record; ${cycle}.`;
      // US federal fiscal year (31 U.S.C. 1102): October to December count toward the next year.
      const fy =
        Number(c.lastEvaluated.slice(0, 4)) + (Number(c.lastEvaluated.slice(5, 7)) >= 10 ? 1 : 0);
      return raw >= 1
        ? `Not evaluated since FY${fy} (${formatNumber(raw, 1)} years ago); ${cycle}.`
        : `Evaluated in FY${fy}, ${formatNumber(raw, 1)} years before ${asOf}.`;
    }
    case 'manualFlag':
      if (!c.manualFlag) return 'Not flagged by a manager.';
      if (!c.flagReason) return 'Flagged by a manager.';
      return `Flagged by a manager: ${c.flagReason}${/[.!?]$/.test(c.flagReason) ? '' : '.'}`;
  }
}

function rawOrNull(term: PriorityTerm, c: PriorityCandidate, raw: number): number | null {
  switch (term) {
    case 'excessEnergy':
      return c.euiNormalized === null ? null : raw;
    case 'excessCost':
      return c.euiNormalized === null || c.pricePerKbtu === null ? null : raw;
    case 'yoyIncrease':
      return c.yoy === null || !(c.yoy.previous > 0) ? null : raw;
    case 'anomalies':
      return c.anomalies === null ? null : raw;
    case 'evaluationAge':
      return c.lastEvaluated === null ? null : raw;
    case 'manualFlag':
      return raw;
  }
}

/** The six term rows of candidate `i`: raw value and unit, scaled value, weight and points. */
export function priorityTerms(
  candidates: readonly PriorityCandidate[],
  scores: PriorityScores,
  i: number,
): TermBreakdown[] {
  const c = candidates[i]!;
  const out = new Array<TermBreakdown>(PRIORITY_TERMS.length);
  for (let t = 0; t < PRIORITY_TERMS.length; t++) {
    const term = PRIORITY_TERMS[t]!;
    const scaled = scores.scaled[t]![i]!;
    const weight = scores.weights[t]!;
    out[t] = {
      term,
      label: PRIORITY_TERM_LABELS[term],
      raw: rawOrNull(term, c, scores.raw[t]![i]!),
      unit: TERM_UNITS[term],
      scaled,
      weight,
      points: 100 * weight * scaled,
    };
  }
  return out;
}

/** Sentences explaining candidate `i`'s score, the largest contribution first. */
export function priorityExplanation(
  candidates: readonly PriorityCandidate[],
  scores: PriorityScores,
  i: number,
  asOf: string,
): string[] {
  const c = candidates[i]!;
  const peer = scores.peers[i]!;
  const T = PRIORITY_TERMS.length;
  // Insertion sort of the six term indices by points, descending; ties keep the term order.
  // (No closures: this runs once per listed building.)
  const order: number[] = [];
  for (let t = 0; t < T; t++) {
    const p = scores.weights[t]! * scores.scaled[t]![i]!;
    let k = order.length;
    while (k > 0 && scores.weights[order[k - 1]!]! * scores.scaled[order[k - 1]!]![i]! < p) k--;
    order.splice(k, 0, t);
  }
  const out = new Array<string>(T);
  for (let r = 0; r < T; r++) {
    const t = order[r]!;
    out[r] = sentence(PRIORITY_TERMS[t]!, c, scores.raw[t]![i]!, peer, asOf);
  }
  return out;
}

/**
 * Breakdown of candidate `i` of a scoring: its term rows and the sentences that explain them.
 * @example priorityBreakdown(cands, scores, i, '2025-06-30').explanation[0]
 */
export function priorityBreakdown(
  candidates: readonly PriorityCandidate[],
  scores: PriorityScores,
  i: number,
  asOf: string,
): PriorityBreakdown {
  return {
    terms: priorityTerms(candidates, scores, i),
    explanation: priorityExplanation(candidates, scores, i, asOf),
  };
}
