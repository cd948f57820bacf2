/**
 * Seeded pseudo-random numbers for the demo scenario: mulberry32 for uniform draws, Box-Muller
 * for normal draws, and a string hash that splits one seed into independent streams, so the
 * weather of one station does not shift when a building is added elsewhere.
 *
 * Nothing here calls Math.random or reads a clock: the same seed and label give the same
 * sequence on every platform (all arithmetic is 32-bit integer or IEEE double).
 */

/**
 * mulberry32, a 32-bit generator with a 2^32 period (Tommy Ettinger, public domain, 2017).
 * Returns a function that yields uniform numbers in [0, 1).
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * FNV-1a 32-bit hash of a seed and a label (Fowler, Noll & Vo; public domain), used to derive
 * one independent stream per part of the scenario.
 */
export function streamSeed(seed: number, label: string): number {
  let h = 0x811c9dc5 ^ (seed >>> 0);
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  // One extra avalanche round so that nearby seeds give unrelated streams.
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b) >>> 0;
  h ^= h >>> 13;
  return h >>> 0;
}

/** A seeded random stream with the draws the scenario needs. */
export class Rng {
  private readonly next: () => number;
  private spare: number | null = null;

  constructor(seed: number, label = '') {
    this.next = mulberry32(streamSeed(seed, label));
  }

  /** Uniform in [0, 1). */
  uniform(): number {
    return this.next();
  }

  /** Uniform in [lo, hi). */
  between(lo: number, hi: number): number {
    return lo + (hi - lo) * this.next();
  }

  /** Integer uniform on [lo, hi], both ends included. */
  int(lo: number, hi: number): number {
    return lo + Math.floor(this.next() * (hi - lo + 1));
  }

  /** Log-uniform in [lo, hi): sizes spread evenly over orders of magnitude. */
  logBetween(lo: number, hi: number): number {
    return Math.exp(this.between(Math.log(lo), Math.log(hi)));
  }

  /** True with probability p. */
  chance(p: number): boolean {
    return this.next() < p;
  }

  /** Standard normal draw by the Box-Muller transform (Box & Muller, 1958), pairs cached. */
  normal(): number {
    if (this.spare !== null) {
      const s = this.spare;
      this.spare = null;
      return s;
    }
    // 1 - u keeps the logarithm's argument in (0, 1].
    const u1 = 1 - this.next();
    const u2 = this.next();
    const r = Math.sqrt(-2 * Math.log(u1));
    this.spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  }

  /** Standard normal truncated to [-limit, limit] by redrawing. */
  truncatedNormal(limit: number): number {
    for (;;) {
      const z = this.normal();
      if (Math.abs(z) <= limit) return z;
    }
  }

  /** One element of a non-empty list. */
  pick<T>(items: readonly T[]): T {
    const item = items[Math.floor(this.next() * items.length)];
    if (item === undefined) throw new Error('pick from an empty list');
    return item;
  }

  /** One element chosen with the given relative weights. */
  weighted<T>(items: readonly (readonly [T, number])[]): T {
    let total = 0;
    for (const [, w] of items) total += w;
    let r = this.next() * total;
    for (const [item, w] of items) {
      r -= w;
      if (r < 0) return item;
    }
    const last = items[items.length - 1];
    if (last === undefined) throw new Error('weighted pick from an empty list');
    return last[0];
  }

  /** A shuffled copy (Fisher-Yates, Durstenfeld's in-place form). */
  shuffle<T>(items: readonly T[]): T[] {
    const out = items.slice();
    for (let i = out.length - 1; i > 0; i--) {
      const j = Math.floor(this.next() * (i + 1));
      const tmp = out[i] as T;
      out[i] = out[j] as T;
      out[j] = tmp;
    }
    return out;
  }
}
