/**
 * The per-building breakdown of an audit-priority score: each term's raw value with its unit, its
 * 0–1 scaled value, its weight and the points it adds, and plain-English sentences that explain
 * the rank, biggest contribution first.
 */
import { fiscalYearOf } from './windows';
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

/**
 * Fixed-point number with thousands separators ("1,234,567.8"). toFixed rather than
 * Intl.NumberFormat: a full shortlist builds ~100,000 of these, and this is several times faster.
 */
function fixed(x: number, digits = 0): string {
  const s = Math.abs(x).toFixed(digits);
  const dot = s.indexOf('.');
  const int = dot < 0 ? s : s.slice(0, dot);
  const frac = dot < 0 ? '' : s.slice(dot);
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return (x < 0 && Number(s) !== 0 ? '-' : '') + grouped + frac;
}

function pct(fraction: number): string {
  const p = Math.abs(fraction) * 100;
  return `${fixed(p, p < 10 ? 1 : 0)} %`;
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
      const vs = `${fixed(c.euiNormalized, 1)} vs ${fixed(m, 1)} kBtu/ft²·yr`;
      return rel > 0
        ? `Uses ${pct(rel)} more energy per square foot than ${peerPhrase(peer)}: ${vs}, about ${fixed(raw)} kBtu a year above the median.`
        : `Uses ${pct(rel)} less energy per square foot than ${peerPhrase(peer)}: ${vs}, no excess.`;
    }
    case 'excessCost':
      if (c.pricePerKbtu === null)
        return 'No energy cost on its bills, so the excess cannot be priced.';
      if (raw === 0) return 'No excess energy to price.';
      return `At $${fixed(c.pricePerKbtu, 4)}/kBtu from its own bills, the excess costs about $${fixed(raw)} a year.`;
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
      const largest = a.largestSe != null ? ` (largest ${fixed(a.largestSe, 1)})` : '';
      return `${a.beyond2Se} of the last ${a.recentPeriods} bills were more than 2 standard errors from the baseline${largest}.`;
    }
    case 'evaluationAge': {
      const cycle = `the evaluation cycle is ${EVALUATION_CYCLE_YEARS} years (EISA 2007 §432)`;
      if (c.lastEvaluated === null) return `No evaluation on record; ${cycle}.`;
      const fy = fiscalYearOf(c.lastEvaluated);
      return raw >= 1
        ? `Not evaluated since FY${fy} (${fixed(raw, 1)} years ago); ${cycle}.`
        : `Evaluated in FY${fy}, ${fixed(raw, 1)} years before ${asOf}.`;
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

/**
 * Breakdown of candidate `i` of a scoring.
 * @example priorityBreakdown(cands, scores, i, '2025-06-30').explanation[0]
 */
export function priorityBreakdown(
  candidates: readonly PriorityCandidate[],
  scores: PriorityScores,
  i: number,
  asOf: string,
): PriorityBreakdown {
  const c = candidates[i]!;
  const peer = scores.peers[i]!;
  const terms: TermBreakdown[] = PRIORITY_TERMS.map((term, t) => {
    const raw = scores.raw[t]![i]!;
    const scaled = scores.scaled[t]![i]!;
    const weight = scores.weights[t]!;
    return {
      term,
      label: PRIORITY_TERM_LABELS[term],
      raw: rawOrNull(term, c, raw),
      unit: TERM_UNITS[term],
      scaled,
      weight,
      points: 100 * weight * scaled,
    };
  });
  const byPoints = terms
    .map((tb, t) => ({ tb, t }))
    .sort((a, b) => b.tb.points - a.tb.points || a.t - b.t);
  const explanation = byPoints.map(({ tb, t }) =>
    sentence(tb.term, c, scores.raw[t]![i]!, peer, asOf),
  );
  return { terms, explanation };
}
