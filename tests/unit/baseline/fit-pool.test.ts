import { describe, expect, it } from 'vitest';
import { FitPool, fitPortfolio, type PoolSeries, type StationWeather } from '../../../src/server/fit-pool';
import { BaselineEngine, fitOptionsSchema } from '../../../src/lib/baseline/engine';
import { normalYearFromTable, normalYearTable } from '../../../src/lib/baseline/normal-year';
import { summarizeFit } from '../../../src/lib/baseline/series-summary';
import { syntheticSeries } from './support';

function portfolio(count: number): { stations: StationWeather[]; series: PoolSeries[] } {
  const stations: StationWeather[] = [];
  const series: PoolSeries[] = [];
  for (let i = 0; i < count; i++) {
    const x = syntheticSeries({ base: 20 + i, heat: (i % 5) * 0.8, tauH: 55 + (i % 7), cool: (i % 3) * 1.5, tauC: 68 + (i % 5), noise: 0.03 }, 100 + i);
    // every series brings its own weather here; a real portfolio shares a few stations
    const station = { id: `st${i % 3}-${i}`, firstDay: x.temps.firstDay, meanF: x.temps.meanF };
    stations.push(station);
    series.push({ id: `series-${i}`, stationId: station.id, ...x.bills });
  }
  return { stations, series };
}

describe('fit pool (worker threads)', () => {
  it('gives the same summaries as the in-process engine, streams every index once and reports progress', async () => {
    const { stations, series } = portfolio(40);
    const pool = FitPool.create({ workers: 2 });
    try {
      expect(pool.size).toBe(2);
      await Promise.all(stations.map((s) => pool.setStation(s)));
      const seen = new Set<number>();
      const progress: number[] = [];
      const got = new Array(series.length);
      for await (const r of pool.fitMany(series, { chunkSize: 7, normalYear: true, onProgress: (p) => progress.push(p.done) })) {
        expect(seen.has(r.index)).toBe(false);
        seen.add(r.index);
        got[r.index] = r.summary;
      }
      expect(seen.size).toBe(series.length);
      expect(progress.at(-1)).toBe(series.length);

      const engine = new BaselineEngine();
      const options = fitOptionsSchema.parse({});
      series.forEach((s, i) => {
        const temps = { firstDay: stations[i]!.firstDay, meanF: stations[i]!.meanF, filledDays: 0 };
        const table = normalYearTable(temps);
        const result = engine.fit(s, temps, options);
        expect(got[i]).toEqual(summarizeFit(s.id, result, table && result.ok ? normalYearFromTable(table) : null));
      });
    } finally {
      await pool.close();
    }
  });

  it('returns full results on request and refuses a series whose station was not sent', async () => {
    const { stations, series } = portfolio(3);
    const pool = FitPool.create({ workers: 1 });
    try {
      await pool.setStation(stations[0]!);
      const out = [];
      for await (const r of pool.fitMany([series[0]!], { detail: 'full' })) out.push(r);
      expect(out[0]!.result?.ok).toBe(true);
      await expect(async () => {
        for await (const _ of pool.fitMany([series[1]!])) void _;
      }).rejects.toThrow(/was not set/);
    } finally {
      await pool.close();
    }
  });

  it('fitPortfolio returns summaries in input order', async () => {
    const { stations, series } = portfolio(6);
    const out = await fitPortfolio(stations, series, { workers: 2, chunkSize: 2 });
    expect(out.map((s) => s.id)).toEqual(series.map((s) => s.id));
    expect(out.every((s) => s.ok)).toBe(true);
  });
});
