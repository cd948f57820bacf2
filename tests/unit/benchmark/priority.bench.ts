/**
 * Speed of the audit-priority ranking on 10,000 constructed buildings (not a unit test: run with
 * `npx tsx tests/unit/benchmark/priority.bench.ts`). Prints one JSON line of median and fastest
 * timings for: the numeric score and order (`scorePriority`), the shortlist with term rows for all
 * and sentences for the top 100, and the shortlist with sentences for every building.
 * Target: the numeric ranking of 10,000 buildings in a few milliseconds.
 */
import { USE_TYPES } from '../../../src/lib/domain';
import { scorePriority, type PriorityCandidate } from '../../../src/lib/benchmark/priority';
import { rankPriority } from '../../../src/lib/benchmark/priority-rank';
import { DEFAULT_PRIORITY_WEIGHTS } from '../../../src/lib/benchmark/priority-weights';

const N = 10_000;
const RUNS = 30;
const asOf = '2025-06-30';

// Constructed candidates from a fixed linear congruential sequence (reproducible, not real data).
let seed = 12345;
const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
const candidates: PriorityCandidate[] = Array.from({ length: N }, (_, i) => ({
  buildingId: `b${i}`,
  buildingNumber: String(1000 + Math.floor(rnd() * 9000)),
  useType: USE_TYPES[i % USE_TYPES.length]!,
  areaFt2: 2_000 + Math.floor(rnd() * 200_000),
  euiNormalized: rnd() < 0.05 ? null : 10 + rnd() * 200,
  pricePerKbtu: rnd() < 0.05 ? null : 0.01 + rnd() * 0.05,
  yoy: rnd() < 0.1 ? null : { current: 9e5 + rnd() * 2e5, previous: 1e6 },
  anomalies:
    rnd() < 0.1 ? null : { recentPeriods: 12, beyond2Se: Math.floor(rnd() * 3), largestSe: null },
  lastEvaluated:
    rnd() < 0.2 ? null : `20${15 + Math.floor(rnd() * 10)}-0${1 + Math.floor(rnd() * 9)}-15`,
  manualFlag: rnd() < 0.02,
  flagReason: null,
}));

/** Median and fastest of RUNS timed calls after a warm-up, in ms. */
function time(fn: () => unknown): { medianMs: number; minMs: number } {
  for (let i = 0; i < 5; i++) fn();
  const t: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const a = performance.now();
    fn();
    t.push(performance.now() - a);
  }
  t.sort((x, y) => x - y);
  const r = (x: number) => Math.round(x * 100) / 100;
  return { medianMs: r(t[Math.floor(t.length / 2)]!), minMs: r(t[0]!) };
}

const weights = DEFAULT_PRIORITY_WEIGHTS;
const score = time(() => scorePriority(candidates, weights, { asOf }));
const rankTop100 = time(() => rankPriority(candidates, weights, { asOf, explainTop: 100 }));
const rankAllSentences = time(() => rankPriority(candidates, weights, { asOf }));
console.log(JSON.stringify({ buildings: N, runs: RUNS, score, rankTop100, rankAllSentences }));
