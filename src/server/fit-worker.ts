/**
 * Worker thread of the baseline fit pool (see fit-pool.ts): keeps the stations' daily
 * temperatures it was sent and fits chunks of series with one reusable engine.
 */
import { parentPort } from 'node:worker_threads';
import { BaselineEngine, fitOptionsSchema, type BaselineResult, type FitOptions } from '../lib/baseline/engine';
import { packDailyMeans, type DailyTemperatures } from '../lib/baseline/daily-temperatures';
import { normalYearFromTable, normalYearTable, type NormalYearDegreeDays } from '../lib/baseline/normal-year';
import { summarizeFit, type SeriesSummary } from '../lib/baseline/series-summary';
import type { FitChunkMessage, WorkerReply, WorkerRequest } from './fit-pool';

interface Station {
  temps: DailyTemperatures;
  normal: NormalYearDegreeDays | null | undefined;
}

const stations = new Map<string, Station>();
const engine = new BaselineEngine();
let cachedOptions: { key: string; parsed: FitOptions } | null = null;

function optionsFor(raw: unknown): FitOptions {
  const key = JSON.stringify(raw ?? {});
  if (cachedOptions === null || cachedOptions.key !== key) cachedOptions = { key, parsed: fitOptionsSchema.parse(raw ?? {}) };
  return cachedOptions.parsed;
}

function normalOf(station: Station): NormalYearDegreeDays | null {
  if (station.normal === undefined) {
    const table = normalYearTable(station.temps);
    station.normal = table === null ? null : normalYearFromTable(table);
  }
  return station.normal;
}

function fitChunk(msg: FitChunkMessage): WorkerReply {
  const options = optionsFor(msg.options);
  const summaries: SeriesSummary[] = [];
  const results: BaselineResult[] | null = msg.detail === 'full' ? [] : null;
  for (let s = 0; s < msg.ids.length; s++) {
    const station = stations.get(msg.stationIds[s]!);
    if (station === undefined) throw new Error(`fit-worker: unknown station ${msg.stationIds[s]}`);
    const from = msg.offsets[s]!;
    const to = msg.offsets[s + 1]!;
    const bills = {
      startDay: msg.startDay.subarray(from, to),
      endDay: msg.endDay.subarray(from, to),
      quantity: msg.quantity.subarray(from, to),
    };
    const result = engine.fit(bills, station.temps, options);
    summaries.push(summarizeFit(msg.ids[s]!, result, msg.normalYear && result.ok ? normalOf(station) : null));
    results?.push(result);
  }
  return { type: 'result', chunkId: msg.chunkId, summaries, results };
}

parentPort?.on('message', (msg: WorkerRequest) => {
  try {
    if (msg.type === 'station') {
      stations.set(msg.id, { temps: packDailyMeans(msg.firstDay, msg.meanF), normal: undefined });
      parentPort!.postMessage({ type: 'station-ready', id: msg.id } satisfies WorkerReply);
    } else {
      parentPort!.postMessage(fitChunk(msg));
    }
  } catch (err) {
    const chunkId = msg.type === 'fit' ? msg.chunkId : -1;
    parentPort!.postMessage({ type: 'error', chunkId, message: err instanceof Error ? (err.stack ?? err.message) : String(err) } satisfies WorkerReply);
  }
});
