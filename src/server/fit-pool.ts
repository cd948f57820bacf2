/**
 * A pool of worker threads that fits many baseline series on every core (Node only).
 *
 * The caller sends each station's daily temperatures once (`setStation`; a copy is transferred
 * to every worker as a typed array), then streams series that reference a station by id.
 * Series travel in chunks of packed typed arrays (transferred, not cloned); results stream back
 * as chunks finish, each tagged with the series' input index. Two chunks are kept in flight per
 * worker so no core waits for the main thread.
 *
 * Worker script: from TypeScript source (tsx, vitest) the pool starts src/server/fit-worker.ts
 * through tsx's loader; from a build it starts dist/workers/fit-worker.mjs, produced by
 * scripts/build-workers.mjs (override with `workerUrl` or PLUMBLINE_FIT_WORKER).
 */
import { Worker, type WorkerOptions } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BaselineResult, FitOptionsInput } from '../lib/baseline/engine';
import type { SeriesSummary } from '../lib/baseline/series-summary';

/** Daily mean temperatures (°F) of one station; NaN marks a missing day. */
export interface StationWeather {
  id: string;
  /** Day number (days since 1970-01-01) of `meanF[0]`. */
  firstDay: number;
  meanF: Float64Array;
}

/** Bills of one series as day numbers (inclusive) and quantities, referencing a station. */
export interface PoolSeries {
  id: string;
  stationId: string;
  startDay: ArrayLike<number>;
  endDay: ArrayLike<number>;
  quantity: ArrayLike<number>;
}

export interface FitManyOptions {
  fit?: FitOptionsInput;
  /** Compute NAC on the normal year of each station's complete calendar years. */
  normalYear?: boolean;
  /** `summary` (default) returns the compact summary; `full` also the whole fit result. */
  detail?: 'summary' | 'full';
  /** Series per chunk (default: about eight chunks per worker, 16–500; 250 for an open-ended iterable). */
  chunkSize?: number;
  onProgress?: (progress: { done: number; total: number | null }) => void;
}

export interface SeriesOutcome {
  /** Position of the series in the input. */
  index: number;
  summary: SeriesSummary;
  result: BaselineResult | null;
}

export interface FitPoolOptions {
  /** Worker threads (default: every core). */
  workers?: number;
  /** Worker script; default as described in the module comment. */
  workerUrl?: URL;
}

// ---- messages (shared with fit-worker.ts) ----
export interface StationMessage {
  type: 'station';
  id: string;
  firstDay: number;
  meanF: Float64Array<ArrayBuffer>;
}
export interface FitChunkMessage {
  type: 'fit';
  chunkId: number;
  options: FitOptionsInput | undefined;
  normalYear: boolean;
  detail: 'summary' | 'full';
  ids: string[];
  stationIds: string[];
  offsets: Int32Array<ArrayBuffer>;
  startDay: Int32Array<ArrayBuffer>;
  endDay: Int32Array<ArrayBuffer>;
  quantity: Float64Array<ArrayBuffer>;
}
export type WorkerRequest = StationMessage | FitChunkMessage;
export type WorkerReply =
  | { type: 'station-ready'; id: string }
  | { type: 'result'; chunkId: number; summaries: SeriesSummary[]; results: BaselineResult[] | null }
  | { type: 'error'; chunkId: number; message: string };

/** Where the worker script is and how to start it. */
export function resolveWorker(override?: URL): { filename: URL | string; options: WorkerOptions } {
  // a built worker needs no loader: do not inherit the parent's (e.g. tsx's) loader flags
  const plain: WorkerOptions = { execArgv: [] };
  const fromEnv = process.env.PLUMBLINE_FIT_WORKER;
  if (override !== undefined) return { filename: override, options: plain };
  if (fromEnv) return { filename: pathToFileURL(resolve(fromEnv)), options: plain };
  const here = import.meta.url;
  if (here.endsWith('.ts')) {
    // Node 20 does not apply `--import tsx` from a worker's execArgv to its .ts entry, so a
    // small bootstrap registers tsx's loader inside the worker, then imports the .ts worker.
    const tsxApi = tsxEsmApiUrl(here);
    const worker = new URL('./fit-worker.ts', here).href;
    const code = `import(${JSON.stringify(tsxApi)}).then((m) => { m.register(); return import(${JSON.stringify(worker)}); });`;
    return { filename: code, options: { eval: true } };
  }
  let dir = dirname(fileURLToPath(here));
  for (let up = 0; up < 6; up++) {
    for (const candidate of [join(dir, 'workers', 'fit-worker.mjs'), join(dir, 'dist', 'workers', 'fit-worker.mjs')]) {
      if (existsSync(candidate)) return { filename: pathToFileURL(candidate), options: plain };
    }
    dir = dirname(dir);
  }
  return { filename: pathToFileURL(resolve(process.cwd(), 'dist/workers/fit-worker.mjs')), options: plain };
}

/** URL of tsx's ESM register API (its `import` export; the CommonJS one cannot register ESM hooks here). */
function tsxEsmApiUrl(from: string): string {
  const pkgPath = createRequire(from).resolve('tsx/package.json');
  const pkg = JSON.parse(readFileSync(pkgPath, 'utf8')) as { exports: Record<string, { import?: { default?: string } }> };
  const target = pkg.exports['./esm/api']?.import?.default ?? './dist/esm/api/index.mjs';
  return pathToFileURL(join(dirname(pkgPath), target)).href;
}

interface Slot {
  worker: Worker;
  inFlight: number;
}

type Pending = { resolve: (reply: WorkerReply) => void; reject: (err: Error) => void };

export class FitPool {
  private readonly slots: Slot[];
  private readonly pending = new Map<number, Pending>();
  private readonly stationWaiters = new Map<string, { left: number; resolve: () => void; reject: (err: Error) => void }>();
  private readonly stationIds = new Set<string>();
  private nextChunk = 0;
  private failure: Error | null = null;
  private closing = false;

  private constructor(workers: Worker[]) {
    this.slots = workers.map((worker) => ({ worker, inFlight: 0 }));
    for (const slot of this.slots) {
      slot.worker.on('message', (reply: WorkerReply) => this.onReply(slot, reply));
      slot.worker.on('error', (err) => this.fail(err));
      slot.worker.on('exit', (code) => {
        if (!this.closing && this.failure === null) this.fail(new Error(`fit worker exited with code ${code}`));
      });
    }
  }

  /** Start the workers. */
  static create(options: FitPoolOptions = {}): FitPool {
    const count = Math.max(1, Math.floor(options.workers ?? availableParallelism()));
    const { filename, options: workerOptions } = resolveWorker(options.workerUrl);
    const workers = Array.from({ length: count }, () => new Worker(filename, workerOptions));
    return new FitPool(workers);
  }

  get size(): number {
    return this.slots.length;
  }

  private fail(err: Error): void {
    this.failure ??= err;
    for (const p of this.pending.values()) p.reject(err);
    this.pending.clear();
    for (const w of this.stationWaiters.values()) w.reject(err);
    this.stationWaiters.clear();
  }

  private onReply(slot: Slot, reply: WorkerReply): void {
    if (reply.type === 'station-ready') {
      const w = this.stationWaiters.get(reply.id);
      if (w !== undefined && --w.left === 0) {
        this.stationWaiters.delete(reply.id);
        w.resolve();
      }
      return;
    }
    slot.inFlight--;
    const p = this.pending.get(reply.chunkId);
    this.pending.delete(reply.chunkId);
    if (reply.type === 'error') {
      const err = new Error(`fit worker failed: ${reply.message}`);
      if (p) p.reject(err);
      else this.fail(err);
      return;
    }
    p?.resolve(reply);
  }

  /** Send a station's daily temperatures to every worker (a transferred copy each). */
  setStation(station: StationWeather): Promise<void> {
    if (this.failure) return Promise.reject(this.failure);
    this.stationIds.add(station.id);
    return new Promise((resolveReady, reject) => {
      this.stationWaiters.set(station.id, { left: this.slots.length, resolve: resolveReady, reject });
      for (const slot of this.slots) {
        const meanF = station.meanF.slice();
        const msg: StationMessage = { type: 'station', id: station.id, firstDay: station.firstDay, meanF };
        slot.worker.postMessage(msg, [meanF.buffer]);
      }
    });
  }

  private packChunk(batch: PoolSeries[], options: FitManyOptions): FitChunkMessage {
    let total = 0;
    for (const s of batch) total += s.startDay.length;
    const offsets = new Int32Array(batch.length + 1);
    const startDay = new Int32Array(total);
    const endDay = new Int32Array(total);
    const quantity = new Float64Array(total);
    let at = 0;
    batch.forEach((s, j) => {
      if (!this.stationIds.has(s.stationId)) throw new Error(`series ${s.id}: station ${s.stationId} was not set`);
      const n = s.startDay.length;
      if (s.endDay.length !== n || s.quantity.length !== n) throw new Error(`series ${s.id}: bill arrays differ in length`);
      for (let i = 0; i < n; i++) {
        startDay[at + i] = s.startDay[i]!;
        endDay[at + i] = s.endDay[i]!;
        quantity[at + i] = s.quantity[i]!;
      }
      at += n;
      offsets[j + 1] = at;
    });
    return {
      type: 'fit',
      chunkId: this.nextChunk++,
      options: options.fit,
      normalYear: options.normalYear ?? false,
      detail: options.detail ?? 'summary',
      ids: batch.map((s) => s.id),
      stationIds: batch.map((s) => s.stationId),
      offsets,
      startDay,
      endDay,
      quantity,
    };
  }

  private dispatch(msg: FitChunkMessage): Promise<WorkerReply> {
    let slot = this.slots[0]!;
    for (const s of this.slots) if (s.inFlight < slot.inFlight) slot = s;
    slot.inFlight++;
    return new Promise((resolveReply, reject) => {
      this.pending.set(msg.chunkId, { resolve: resolveReply, reject });
      slot.worker.postMessage(msg, [msg.offsets.buffer, msg.startDay.buffer, msg.endDay.buffer, msg.quantity.buffer]);
    });
  }

  /**
   * Fit every series, yielding outcomes as chunks finish (not in input order; use `index`).
   * @throws when a worker fails or a series references a station that was not set
   */
  async *fitMany(series: Iterable<PoolSeries>, options: FitManyOptions = {}): AsyncGenerator<SeriesOutcome> {
    if (this.failure) throw this.failure;
    const total = Array.isArray(series) ? series.length : null;
    // about eight chunks per worker balances the load; bounded so messages stay cheap
    const automatic = total === null ? 250 : Math.min(500, Math.max(16, Math.ceil(total / (this.slots.length * 8))));
    const chunkSize = Math.max(1, Math.floor(options.chunkSize ?? automatic));
    const maxInFlight = this.slots.length * 2;
    const it = series[Symbol.iterator]();
    const inFlight = new Map<number, Promise<{ first: number; reply: WorkerReply }>>();
    let index = 0;
    let done = 0;
    let exhausted = false;
    const fill = (): void => {
      while (!exhausted && inFlight.size < maxInFlight) {
        const batch: PoolSeries[] = [];
        while (batch.length < chunkSize) {
          const next = it.next();
          if (next.done) {
            exhausted = true;
            break;
          }
          batch.push(next.value);
        }
        if (batch.length === 0) break;
        const first = index;
        index += batch.length;
        const msg = this.packChunk(batch, options);
        inFlight.set(msg.chunkId, this.dispatch(msg).then((reply) => ({ first, reply })));
      }
    };
    fill();
    while (inFlight.size > 0) {
      const { first, reply } = await Promise.race(inFlight.values());
      if (reply.type !== 'result') throw new Error('fit pool: unexpected reply');
      inFlight.delete(reply.chunkId);
      fill();
      for (let j = 0; j < reply.summaries.length; j++) {
        yield { index: first + j, summary: reply.summaries[j]!, result: reply.results?.[j] ?? null };
      }
      done += reply.summaries.length;
      options.onProgress?.({ done, total });
    }
  }

  /** Stop the workers. */
  async close(): Promise<void> {
    this.closing = true;
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }
}

/**
 * Fit a whole portfolio with a temporary pool and return the summaries in input order.
 * @example await fitPortfolio([station], series, { normalYear: true, workers: 2 })
 */
export async function fitPortfolio(
  stations: readonly StationWeather[],
  series: readonly PoolSeries[],
  options: FitManyOptions & FitPoolOptions = {},
): Promise<SeriesSummary[]> {
  const pool = FitPool.create(options);
  try {
    await Promise.all(stations.map((s) => pool.setStation(s)));
    const out = new Array<SeriesSummary>(series.length);
    for await (const r of pool.fitMany(series, options)) out[r.index] = r.summary;
    return out;
  } finally {
    await pool.close();
  }
}
