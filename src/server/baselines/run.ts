/**
 * Portfolio runs: fit every meter's baseline (building × commodity) on worker threads, on demand,
 * a few seconds after bills or weather change (debounced), and nightly. Each result is stored
 * with a hash of the bills and weather it came from; an analyst's acceptance survives a refit
 * only when those are unchanged.
 */
import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { acceptanceThresholdsSchema, DEFAULT_ACCEPTANCE, defaultShapesFor, fillSingleMissingDays, prepareBaselineBills, type BaselineResult, type FitOptionsInput, type Shape } from '../../lib/baseline';
import { getSetting } from '../settings';
import type { Commodity, Unit } from '../../lib/domain';
import { conversionFactor, meterHeatContent } from '../../lib/units/convert';
import { getDb, queryRows } from '../../db/client';
import { bulkInsert } from '../../db/bulk';
import { FitPool, type PoolSeries } from '../fit-pool';
import { compactFit } from './compact';

export const DEFAULT_WINDOW_DAYS = 3 * 365;

export interface RunState {
  running: boolean;
  trigger: string;
  total: number;
  done: number;
  startedAt: string | null;
  finishedAt: string | null;
  error: string | null;
  last: { fitted: number; failed: number; seconds: number } | null;
}

const KEY = Symbol.for('plumbline.baseline-run');
type Holder = typeof globalThis & { [KEY]?: { state: RunState; queued: Set<string> | 'all' | null; timer: ReturnType<typeof setTimeout> | null; current: Promise<void> | null } };
const holder = globalThis as Holder;
const run = (holder[KEY] ??= {
  state: { running: false, trigger: '', total: 0, done: 0, startedAt: null, finishedAt: null, error: null, last: null },
  queued: null,
  timer: null,
  current: null,
});

export function runState(): RunState {
  return { ...run.state };
}

interface MeterRow {
  id: string;
  buildingId: string;
  installationId: string;
  commodity: Commodity;
  unit: Unit;
  heat: number | null;
  stationId: string | null;
}

interface Previous {
  status: string;
  shape: string | null;
  overrideShape: string | null;
  inputHash: string;
  periodStart: string | null;
  periodEnd: string | null;
  periodChosen: boolean;
}

const isoDay = (d: number) => new Date(d * 86_400_000).toISOString().slice(0, 10);
const dayOf = (iso: string) => Math.round(Date.parse(`${iso}T00:00:00Z`) / 86_400_000);

/** Fits the baselines of the given installations (all when omitted). Returns counts. */
export async function refitBaselines(scope: { installationIds?: string[]; meterIds?: string[] } = {}, trigger = 'manual', options: { workers?: number } = {}) {
  const started = Date.now();
  const db = await getDb();
  const where = scope.meterIds ? sql`m.id = any(${sql.param(scope.meterIds)}::uuid[])` : scope.installationIds ? sql`m.installation_id = any(${sql.param(scope.installationIds)}::uuid[])` : sql`true`;
  const meters = await queryRows<MeterRow>(
    db,
    sql`
      select m.id, m.building_id as "buildingId", m.installation_id as "installationId", m.commodity, m.unit,
             m.heat_content_kbtu_per_unit as heat,
             (select s.station_id from installation_station s where s.installation_id = m.installation_id order by s.is_primary desc limit 1) as "stationId"
        from meter m join building b on b.id = m.building_id
       where m.active and not b.archived and ${where}`,
  );
  Object.assign(run.state, { total: meters.length, done: 0 });
  if (meters.length === 0) return { fitted: 0, failed: 0, seconds: 0 };

  const meterIds = meters.map((m) => m.id);
  const prevRows = await queryRows<{ meter_id: string; status: string; shape: string | null; override_shape: string | null; input_hash: string; period_start: string | null; period_end: string | null; period_chosen: boolean }>(
    db,
    sql`select meter_id, status, shape, override_shape, input_hash, period_start::text, period_end::text, period_chosen
          from baseline where meter_id = any(${sql.param(meterIds)}::uuid[])`,
  );
  const previous = new Map<string, Previous>(
    prevRows.map((r) => [r.meter_id, { status: r.status, shape: r.shape, overrideShape: r.override_shape, inputHash: r.input_hash, periodStart: r.period_start, periodEnd: r.period_end, periodChosen: r.period_chosen }]),
  );

  const billRows = await queryRows<{ m: string; s: number; e: number; q: number; u: Unit; est: boolean }>(
    db,
    sql`select meter_id as m, (period_start - date '1970-01-01')::int as s, (period_end - date '1970-01-01')::int as e, quantity as q, unit as u, estimated as est
          from bill where meter_id = any(${sql.param(meterIds)}::uuid[]) order by meter_id, period_start`,
  );
  const billsByMeter = new Map<string, typeof billRows>();
  for (const b of billRows) {
    let list = billsByMeter.get(b.m);
    if (!list) billsByMeter.set(b.m, (list = []));
    list.push(b);
  }

  // Weather: one packed daily series per station, sent to the workers once.
  const stationIds = [...new Set(meters.map((m) => m.stationId).filter((s): s is string => !!s))];
  const stations = new Map<string, { firstDay: number; meanF: Float64Array; hash: string }>();
  for (const id of stationIds) {
    const days = await queryRows<{ d: number; x: number | null; n: number | null }>(
      db,
      sql`select (date - date '1970-01-01')::int as d, tmax_f as x, tmin_f as n from weather_day where station_id = ${id} order by date`,
    );
    if (days.length === 0) continue;
    const first = days[0]!.d;
    const meanF = new Float64Array(days[days.length - 1]!.d - first + 1).fill(Number.NaN);
    for (const r of days) if (r.x !== null && r.n !== null && r.n <= r.x) meanF[r.d - first] = (r.x + r.n) / 2;
    fillSingleMissingDays(meanF);
    stations.set(id, { firstDay: first, meanF, hash: createHash('sha1').update(new Uint8Array(meanF.buffer)).digest('hex') });
  }

  const { updatedAt: _a, ...acceptanceNow } = await getSetting('baseline-acceptance', acceptanceThresholdsSchema, DEFAULT_ACCEPTANCE);
  // Series, grouped by the fit options they need (shapes depend on commodity and overrides).
  type Job = { meter: MeterRow; series: PoolSeries; from: number; to: number; hash: string; notes: object; shapes: Shape[] };
  const groups = new Map<string, Job[]>();
  const noData: { meter: MeterRow; reason: string; from: number | null; to: number | null; hash: string }[] = [];
  for (const m of meters) {
    const prev = previous.get(m.id);
    const bills = billsByMeter.get(m.id) ?? [];
    const station = m.stationId ? stations.get(m.stationId) : undefined;
    const lastEnd = bills.length ? Math.max(...bills.map((b) => b.e)) : null;
    const to = prev?.periodChosen && prev.periodEnd ? dayOf(prev.periodEnd) : lastEnd;
    const from = prev?.periodChosen && prev.periodStart ? dayOf(prev.periodStart) : to === null ? null : to - DEFAULT_WINDOW_DAYS + 1;
    if (to === null || from === null) {
      noData.push({ meter: m, reason: 'no-periods', from, to, hash: 'no-bills' });
      continue;
    }
    if (!station) {
      noData.push({ meter: m, reason: 'insufficient-temperature', from, to, hash: `no-weather:${bills.length}` });
      continue;
    }
    const heat = m.heat ?? undefined;
    const prepared = prepareBaselineBills(
      bills.map((b) => ({ startDay: b.s, endDay: b.e, quantity: b.q, unit: b.u, estimated: b.est })),
      { commodity: m.commodity, unit: m.unit, heat: meterHeatContent(m.commodity, m.unit, heat), fromDay: from, toDay: to },
    );
    const shapes: Shape[] = prev?.overrideShape ? [prev.overrideShape as Shape] : defaultShapesFor(m.commodity);
    const hash = createHash('sha1')
      .update(`${station.hash}|${from}|${to}|${shapes.join(',')}|${JSON.stringify(acceptanceNow)}|`)
      .update(new Uint8Array(prepared.startDay.buffer))
      .update(new Uint8Array(prepared.endDay.buffer))
      .update(new Uint8Array(prepared.quantity.buffer))
      .digest('hex');
    const key = shapes.join(',');
    let list = groups.get(key);
    if (!list) groups.set(key, (list = []));
    list.push({ meter: m, series: { id: m.id, stationId: m.stationId!, startDay: prepared.startDay, endDay: prepared.endDay, quantity: prepared.quantity }, from, to, hash, notes: prepared.notes, shapes });
  }

  const acceptance = acceptanceNow;
  const results = new Map<string, { job: Job; result: BaselineResult; nac: number | null }>();
  const total = [...groups.values()].reduce((s, g) => s + g.length, 0);
  if (total > 0) {
    const pool = FitPool.create({ workers: options.workers });
    try {
      for (const [id, st] of stations) await pool.setStation({ id, firstDay: st.firstDay, meanF: st.meanF });
      for (const jobs of groups.values()) {
        const fit: FitOptionsInput = { shapes: jobs[0]!.shapes, includePeriods: true, statistics: 'all-shapes', acceptance };
        for await (const o of pool.fitMany(jobs.map((j) => j.series), { fit, normalYear: true, detail: 'full' })) {
          const job = jobs[o.index]!;
          results.set(job.meter.id, { job, result: o.result!, nac: o.summary.nac });
          run.state.done++;
        }
      }
    } finally {
      await pool.close();
    }
  }

  // Store: one row per meter.
  const rows: Record<string, unknown>[] = [];
  let failed = 0;
  for (const { job, result, nac } of results.values()) {
    const m = job.meter;
    const prev = previous.get(m.id);
    let status: string;
    let shape: string | null = null;
    let reason: string | null = null;
    if (!result.ok) {
      status = 'insufficient-data';
      reason = result.reason;
      failed++;
    } else {
      shape = result.selected.shape;
      const meets = result.acceptance.status === 'meets-criteria';
      status = result.acceptance.status === 'insufficient-data' ? 'insufficient-data' : meets ? 'needs-review' : 'failing-criteria';
      // An analyst's acceptance stands while the data it was given on have not changed.
      if (prev?.status === 'accepted' && prev.inputHash === job.hash && prev.shape === shape) status = 'accepted';
    }
    const factor = conversionFactor(m.commodity, m.unit, meterHeatContent(m.commodity, m.unit, m.heat));
    const q = result.ok ? result.selected.quality : null;
    rows.push({
      meterId: m.id,
      buildingId: m.buildingId,
      installationId: m.installationId,
      commodity: m.commodity,
      unit: m.unit,
      periodStart: isoDay(job.from),
      periodEnd: isoDay(job.to),
      periodChosen: prev?.periodChosen ?? false,
      status,
      shape,
      overrideShape: prev?.overrideShape ?? null,
      reason,
      r2: q?.r2 ?? null,
      adjR2: q?.adjR2 ?? null,
      cvrmse: q?.cvrmse ?? null,
      nac,
      nacConverted: nac !== null && factor.ok ? nac * factor.perUnit : null,
      fit: compactFit(result, job.notes),
      inputHash: job.hash,
    });
  }
  for (const n of noData) {
    failed++;
    rows.push({
      meterId: n.meter.id,
      buildingId: n.meter.buildingId,
      installationId: n.meter.installationId,
      commodity: n.meter.commodity,
      unit: n.meter.unit,
      periodStart: n.from === null ? null : isoDay(n.from),
      periodEnd: n.to === null ? null : isoDay(n.to),
      periodChosen: previous.get(n.meter.id)?.periodChosen ?? false,
      status: 'insufficient-data',
      shape: null,
      overrideShape: previous.get(n.meter.id)?.overrideShape ?? null,
      reason: n.reason,
      r2: null,
      adjR2: null,
      cvrmse: null,
      nac: null,
      nacConverted: null,
      fit: { ok: false, reason: n.reason, detail: n.reason === 'no-periods' ? 'no bills for this meter' : 'no weather station with temperatures for this installation' },
      inputHash: n.hash,
    });
  }
  await storeBaselines(rows);
  run.state.done = meters.length;
  return { fitted: results.size - (failed - noData.length), failed, seconds: (Date.now() - started) / 1000, trigger };
}

async function storeBaselines(rows: Record<string, unknown>[]): Promise<void> {
  const db = await getDb();
  await db.transaction(async (tx) => {
    for (let i = 0; i < rows.length; i += 2000) {
      const part = rows.slice(i, i + 2000);
      const c = (k: string) => part.map((r) => r[k] ?? null);
      await bulkInsert(
        tx,
        'baseline',
        [
          { name: 'meter_id', type: 'uuid', values: c('meterId') },
          { name: 'building_id', type: 'uuid', values: c('buildingId') },
          { name: 'installation_id', type: 'uuid', values: c('installationId') },
          { name: 'commodity', type: 'text', values: c('commodity') },
          { name: 'unit', type: 'text', values: c('unit') },
          { name: 'period_start', type: 'date', values: c('periodStart') },
          { name: 'period_end', type: 'date', values: c('periodEnd') },
          { name: 'period_chosen', type: 'bool', values: c('periodChosen') },
          { name: 'status', type: 'text', values: c('status') },
          { name: 'shape', type: 'text', values: c('shape') },
          { name: 'override_shape', type: 'text', values: c('overrideShape') },
          { name: 'reason', type: 'text', values: c('reason') },
          { name: 'r2', type: 'float8', values: c('r2') },
          { name: 'adj_r2', type: 'float8', values: c('adjR2') },
          { name: 'cvrmse', type: 'float8', values: c('cvrmse') },
          { name: 'nac', type: 'float8', values: c('nac') },
          { name: 'nac_converted', type: 'float8', values: c('nacConverted') },
          { name: 'fit', type: 'jsonb', values: part.map((r) => JSON.stringify(r.fit)) },
          { name: 'input_hash', type: 'text', values: c('inputHash') },
        ],
        `on conflict (meter_id) do update set building_id = excluded.building_id, installation_id = excluded.installation_id,
           commodity = excluded.commodity, unit = excluded.unit, period_start = excluded.period_start, period_end = excluded.period_end,
           period_chosen = excluded.period_chosen, status = excluded.status, shape = excluded.shape, override_shape = excluded.override_shape,
           reason = excluded.reason, r2 = excluded.r2, adj_r2 = excluded.adj_r2, cvrmse = excluded.cvrmse, nac = excluded.nac,
           nac_converted = excluded.nac_converted, fit = excluded.fit, input_hash = excluded.input_hash, fitted_at = now(),
           reviewed_by = case when excluded.status = 'accepted' then baseline.reviewed_by end,
           reviewed_at = case when excluded.status = 'accepted' then baseline.reviewed_at end`,
      );
    }
  });
}

/** Runs a refit now, one at a time; a request during a run is queued and merged. */
export async function runRefit(scope: { installationIds?: string[] } | 'all', trigger: string): Promise<void> {
  const ids = scope === 'all' ? 'all' : new Set(scope.installationIds ?? []);
  if (run.current) {
    run.queued = run.queued === 'all' || ids === 'all' ? 'all' : new Set([...(run.queued ?? []), ...ids]);
    return run.current;
  }
  Object.assign(run.state, { running: true, trigger, startedAt: new Date().toISOString(), finishedAt: null, error: null });
  run.current = (async () => {
    try {
      const scope = ids === 'all' ? {} : { installationIds: [...ids] };
      const r = await refitBaselines(scope, trigger);
      run.state.last = { fitted: r.fitted, failed: r.failed, seconds: r.seconds };
      const { computeBuildingMetrics } = await import('../benchmark/metrics');
      await computeBuildingMetrics(scope);
    } catch (e) {
      run.state.error = (e as Error).message;
      console.error('[baselines] refit failed:', e);
    } finally {
      Object.assign(run.state, { running: false, finishedAt: new Date().toISOString() });
      run.current = null;
    }
    const next = run.queued;
    run.queued = null;
    if (next) await runRefit(next === 'all' ? 'all' : { installationIds: [...next] }, `${trigger} (queued)`);
  })();
  return run.current;
}

/** Bills or weather changed: refit those installations a few seconds later (changes in a burst are merged). */
export function scheduleRefit(installationIds: string[] | 'all', reason: string, delayMs = Number(process.env.PLUMBLINE_REFIT_DELAY_MS ?? 5000)): void {
  if (process.env.PLUMBLINE_JOBS === '0') return;
  run.queued = run.queued === 'all' || installationIds === 'all' ? 'all' : new Set([...(run.queued ?? []), ...installationIds]);
  if (run.timer) clearTimeout(run.timer);
  run.timer = setTimeout(() => {
    run.timer = null;
    const q = run.queued;
    run.queued = null;
    if (q) void runRefit(q === 'all' ? 'all' : { installationIds: [...q] }, reason);
  }, delayMs);
  run.timer.unref?.();
}

/** Bills or weather of these installations changed: mark their fits stale and schedule a refit. */
export async function dataChanged(installationIds: string[], reason: string): Promise<void> {
  if (installationIds.length === 0) return;
  const db = await getDb();
  await db.execute(sql`update installation set data_changed_at = now() where id = any(${sql.param(installationIds)}::uuid[])`);
  scheduleRefit(installationIds, reason);
}
