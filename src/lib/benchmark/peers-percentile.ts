/**
 * Percentile rank of each building among the region's own buildings of the same use type.
 *
 * Method: the percentile rank of Wikipedia's "Percentile rank" article and of SciPy's
 * `percentileofscore(kind='mean')`: PR = 100 · (B + E/2) / n, where n counts the group's
 * buildings that have a value (the building itself included), B those with a strictly lower EUI
 * and E those with an equal EUI (itself included). Ties therefore share one percentile, halfway
 * between "strictly below" and "at or below". A higher percentile means more energy per ft² than
 * its peers. A group with fewer than two valued buildings has no percentile (`too-few-peers`).
 *
 * Cost: one sort per group and two binary searches per building, O(n log n).
 */

export interface PeerValue {
  readonly id: string;
  /** Grouping key, normally the use type (callers scope the list to one region). */
  readonly group: string;
  /** EUI (or any intensity) of the building; null when it has none. */
  readonly value: number | null;
}

export type PeerPercentile =
  | {
      readonly ok: true;
      /** 0–100; 100 · (below + equal / 2) / n. */
      readonly percentile: number;
      /** Buildings in the group with a value, this one included. */
      readonly n: number;
      readonly below: number;
      /** Buildings with the same value, this one included. */
      readonly equal: number;
    }
  | { readonly ok: false; readonly reason: 'no-value' | 'too-few-peers'; readonly n: number };

/** Index of the first element ≥ x (when `strict` false) or > x (when true) in a sorted array. */
function bound(sorted: Float64Array, x: number, strict: boolean): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    const v = sorted[mid]!;
    if (v < x || (strict && v === x)) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Percentile rank of every item within its group.
 * @example
 * peerPercentiles([{id:'a',group:'office',value:1}, {id:'b',group:'office',value:3}]).get('b')
 * // { ok: true, percentile: 75, n: 2, below: 1, equal: 1 }
 */
export function peerPercentiles(items: readonly PeerValue[]): Map<string, PeerPercentile> {
  const groups = new Map<string, number[]>();
  for (const it of items) {
    if (it.value === null || !Number.isFinite(it.value)) continue;
    const list = groups.get(it.group);
    if (list) list.push(it.value);
    else groups.set(it.group, [it.value]);
  }
  const sorted = new Map<string, Float64Array>();
  for (const [g, values] of groups) sorted.set(g, Float64Array.from(values).sort());

  const out = new Map<string, PeerPercentile>();
  for (const it of items) {
    const s = sorted.get(it.group);
    const n = s?.length ?? 0;
    if (it.value === null || !Number.isFinite(it.value) || s === undefined) {
      out.set(it.id, { ok: false, reason: 'no-value', n });
    } else if (n < 2) {
      out.set(it.id, { ok: false, reason: 'too-few-peers', n });
    } else {
      const below = bound(s, it.value, false);
      const equal = bound(s, it.value, true) - below;
      out.set(it.id, { ok: true, percentile: (100 * (below + equal / 2)) / n, n, below, equal });
    }
  }
  return out;
}
