/**
 * Weather stations: inventory, daily observations (from a file or the weather service), coverage
 * per year with gaps, and degree days at any base for any period, including the normal year.
 */
import { asc, count, eq, inArray, max, min, sql } from 'drizzle-orm';
import { parseWeatherCsv, type RowProblem, type WeatherDay } from '../../lib/formats';
import type { StationInput } from '../../lib/schemas/weather';
import {
  buildDailySeries,
  buildDegreeDayTable,
  coverageByYear,
  dayFromIso,
  dayFromCivil,
  daysInMonth,
  degreeDaySum,
  fillSingleMissingDays,
  isoFromDay,
  missingRanges,
  normalYearDegreeDays,
  periodDegreeDays,
  type DegreeDayTable,
  type TemperatureUnit,
} from '../../lib/weather';
import { getDb, queryRows } from '../../db/client';
import { importRun, installation, installationStation, weatherDay, weatherStation } from '../../db/schema';
import { logActivity } from '../activity';
import { can, installationByCode, type Actor } from '../authz';
import { isUniqueViolation } from '../db-errors';
import { errors, HttpError } from '../http';
import { fetchDailySummaries } from './client';
import { dataChanged } from '../baselines/run';

/** Stations the actor may see: all for unscoped roles, those of their installations otherwise. */
async function visibleStationIds(actor: Actor): Promise<string[] | null> {
  if (!actor.scoped) return null;
  if (actor.installationIds.length === 0) return [];
  const db = await getDb();
  const rows = await db
    .select({ id: installationStation.stationId })
    .from(installationStation)
    .where(inArray(installationStation.installationId, [...actor.installationIds]));
  return rows.map((r) => r.id);
}

export async function listStations(actor: Actor) {
  const db = await getDb();
  const visible = await visibleStationIds(actor);
  const stats = db
    .select({ stationId: weatherDay.stationId, first: min(weatherDay.date).as('first'), last: max(weatherDay.date).as('last'), days: count().as('days') })
    .from(weatherDay)
    .groupBy(weatherDay.stationId)
    .as('stats');
  const rows = await db
    .select({
      id: weatherStation.id,
      code: weatherStation.code,
      name: weatherStation.name,
      latitude: weatherStation.latitude,
      longitude: weatherStation.longitude,
      elevationFt: weatherStation.elevationFt,
      serviceId: weatherStation.serviceId,
      firstDate: stats.first,
      lastDate: stats.last,
      days: sql<number>`coalesce(${stats.days}, 0)::int`,
    })
    .from(weatherStation)
    .leftJoin(stats, eq(stats.stationId, weatherStation.id))
    .where(visible === null ? undefined : visible.length ? inArray(weatherStation.id, visible) : sql`false`)
    .orderBy(asc(weatherStation.code));
  const links = await db
    .select({ stationId: installationStation.stationId, code: installation.code, primary: installationStation.primary })
    .from(installationStation)
    .innerJoin(installation, eq(installation.id, installationStation.installationId));
  return rows.map((r) => ({ ...r, installations: links.filter((l) => l.stationId === r.id).map((l) => l.code).sort() }));
}

/** A station the actor may see. @throws 404 */
export async function stationByCode(actor: Actor, code: string) {
  const db = await getDb();
  const [row] = await db.select().from(weatherStation).where(eq(weatherStation.code, code));
  const visible = await visibleStationIds(actor);
  if (!row || (visible !== null && !visible.includes(row.id))) throw errors.notFound(`No weather station ${code} in your installations.`);
  return row;
}

/** A station the actor may load data into. @throws 403/404 */
async function writableStation(actor: Actor, code: string) {
  if (!can(actor, 'weather:write')) throw errors.forbidden('Your role may not load weather data.');
  return stationByCode(actor, code);
}

export async function createStation(actor: Actor, input: StationInput, ip = '') {
  if (!can(actor, 'weather:write')) throw errors.forbidden('Your role may not add weather stations.');
  const db = await getDb();
  const inst = await installationByCode(db, actor, input.installation);
  try {
    const row = await db.transaction(async (tx) => {
      const [s] = await tx
        .insert(weatherStation)
        .values({ code: input.code, name: input.name, latitude: input.latitude, longitude: input.longitude, elevationFt: input.elevationFt, serviceId: input.serviceId })
        .returning();
      const [existing] = await tx.select({ n: count() }).from(installationStation).where(eq(installationStation.installationId, inst.id));
      await tx.insert(installationStation).values({ installationId: inst.id, stationId: s!.id, primary: Number(existing?.n ?? 0) === 0 });
      return s!;
    });
    await logActivity({ action: 'weather.station-create', userId: actor.id, actor: actor.email, entityType: 'weather-station', entityId: row.id, installationId: inst.id, ip, details: { code: input.code } });
    return row;
  } catch (e) {
    if (isUniqueViolation(e)) throw errors.conflict(`A station with code ${input.code} already exists.`, [{ field: 'code', message: 'already in use' }]);
    throw e;
  }
}

export interface WeatherLoadReport {
  id: string;
  station: string;
  source: string;
  counts: { rows: number; new: number; changed: number; unchanged: number; rejected: number };
  problems: RowProblem[];
}

/** Stores daily observations (insert or replace by date) and records the load. */
async function storeDays(actor: Actor, station: { id: string; code: string }, days: WeatherDay[], problems: RowProblem[], rejected: number, meta: { kind: 'weather-csv' | 'weather-service'; fileName: string; source: string; bytes: number }, ip: string): Promise<WeatherLoadReport> {
  const db = await getDb();
  const source = meta.kind === 'weather-csv' ? 'file' : 'service';
  const result = await db.transaction(async (tx) => {
    const [run] = await tx
      .insert(importRun)
      .values({ kind: meta.kind, status: 'committed', fileName: meta.fileName, fileBytes: meta.bytes, stationId: station.id, uploadedBy: actor.id, uploadedByEmail: actor.email, committedAt: new Date(), problems: problems.slice(0, 10_000), problemCount: problems.length })
      .returning({ id: importRun.id });
    let inserted = 0;
    let changed = 0;
    for (let i = 0; i < days.length; i += 5000) {
      const chunk = days.slice(i, i + 5000);
      const r = await queryRows<{ inserted: boolean }>(tx, sql`
        insert into weather_day (station_id, date, tmax_f, tmin_f, source, import_id)
        select ${station.id}::uuid, d, x, n, ${source}, ${run!.id}::uuid
          from unnest(${sql.param(chunk.map((d) => d.date))}::date[], ${sql.param(chunk.map((d) => d.tmaxF))}::float8[], ${sql.param(chunk.map((d) => d.tminF))}::float8[]) as u(d, x, n)
        on conflict (station_id, date) do update set tmax_f = excluded.tmax_f, tmin_f = excluded.tmin_f, source = excluded.source, import_id = excluded.import_id
          where weather_day.tmax_f is distinct from excluded.tmax_f or weather_day.tmin_f is distinct from excluded.tmin_f
        returning (xmax = 0) as inserted`);
      for (const row of r) {
        if (row.inserted) inserted++;
        else changed++;
      }
    }
    const counts = { rows: days.length + rejected, new: inserted, changed, unchanged: days.length - inserted - changed, rejected };
    await tx.update(importRun).set({ counts }).where(eq(importRun.id, run!.id));
    return { id: run!.id, counts };
  });
  if (result.counts.new + result.counts.changed > 0) {
    const served = await db.select({ id: installationStation.installationId }).from(installationStation).where(eq(installationStation.stationId, station.id));
    await dataChanged(served.map((s) => s.id), 'weather changed');
  }
  await logActivity({ action: meta.kind === 'weather-csv' ? 'weather.import' : 'weather.fetch', userId: actor.id, actor: actor.email, entityType: 'weather-station', entityId: station.id, ip, details: { station: station.code, counts: result.counts, source: meta.source } });
  return { id: result.id, station: station.code, source: meta.source, counts: result.counts, problems };
}

/** Loads a daily-summaries CSV (STATION, DATE, TMAX, TMIN; °F or °C as stated) into a station. */
export async function importWeatherFile(actor: Actor, code: string, file: { name: string; bytes: Uint8Array }, units: 'standard' | 'metric' | 'F' | 'C' | 'tenths-C', ip = ''): Promise<WeatherLoadReport> {
  const station = await writableStation(actor, code);
  // Rows must be for this station: its weather-service id, or its own code when it has none
  // (a blank STATION column is filled with it).
  const parsed = await parseWeatherCsv(file.bytes, { units, station: station.serviceId ?? station.code });
  if (!parsed.ok) throw errors.unprocessable(parsed.message, { reason: parsed.reason });
  return storeDays(actor, station, parsed.days, parsed.problems, parsed.counts.rejected, { kind: 'weather-csv', fileName: file.name, source: 'file', bytes: file.bytes.length }, ip);
}

/** Fetches [start, end] from the weather service into a station (it needs a service id). */
export async function fetchWeather(actor: Actor, code: string, range: { start: string; end: string }, ip = ''): Promise<WeatherLoadReport> {
  const station = await writableStation(actor, code);
  if (!station.serviceId) throw errors.conflict(`Station ${code} has no weather-service id (a GHCN-Daily id such as USW00014739).`);
  const fetched = await fetchDailySummaries(station.serviceId, range.start, range.end);
  if (!fetched.ok) throw new HttpError(502, 'weather_service', fetched.message);
  return storeDays(actor, station, fetched.days, fetched.problems, 0, { kind: 'weather-service', fileName: `${station.serviceId} ${range.start}..${range.end}`, source: fetched.source, bytes: 0 }, ip);
}

/** The station's daily series (single missing days filled) and its degree-day table. */
export async function stationWeather(stationId: string): Promise<{ table: DegreeDayTable; filled: number[]; gaps: { start: string; end: string; days: number }[] } | null> {
  const db = await getDb();
  const rows = await db
    .select({ s: sql<number>`(${weatherDay.date} - date '1970-01-01')::int`, x: weatherDay.tmaxF, n: weatherDay.tminF })
    .from(weatherDay)
    .where(eq(weatherDay.stationId, stationId));
  if (rows.length === 0) return null;
  const built = buildDailySeries({ days: rows.map((r) => r.s), tmax: rows.map((r) => r.x), tmin: rows.map((r) => r.n), unit: 'F' });
  const fill = fillSingleMissingDays(built.series);
  const gaps = missingRanges(fill.series).map((g) => ({ start: isoFromDay(g.startDay), end: isoFromDay(g.endDay), days: g.days }));
  return { table: buildDegreeDayTable(fill.series), filled: fill.filledDays, gaps };
}

export async function stationDetail(actor: Actor, code: string) {
  const station = await stationByCode(actor, code);
  const db = await getDb();
  const rows = await db
    .select({ s: sql<number>`(${weatherDay.date} - date '1970-01-01')::int`, x: weatherDay.tmaxF, n: weatherDay.tminF })
    .from(weatherDay)
    .where(eq(weatherDay.stationId, station.id));
  const links = await db
    .select({ code: installation.code, name: installation.name, primary: installationStation.primary })
    .from(installationStation)
    .innerJoin(installation, eq(installation.id, installationStation.installationId))
    .where(eq(installationStation.stationId, station.id));
  if (rows.length === 0) return { station, installations: links, coverage: [], gaps: [], interpolatedDays: [], firstDate: null, lastDate: null };
  const built = buildDailySeries({ days: rows.map((r) => r.s), tmax: rows.map((r) => r.x), tmin: rows.map((r) => r.n), unit: 'F' });
  const fill = fillSingleMissingDays(built.series);
  return {
    station,
    installations: links,
    firstDate: isoFromDay(built.series.firstDay),
    lastDate: isoFromDay(built.series.firstDay + built.series.status.length - 1),
    coverage: coverageByYear(fill.series),
    // Gaps longer than a day stay missing and are reported; single days were interpolated.
    gaps: missingRanges(fill.series).map((g) => ({ start: isoFromDay(g.startDay), end: isoFromDay(g.endDay), days: g.days })),
    interpolatedDays: fill.filledDays.map(isoFromDay),
    invalidDays: built.invalidDays.map(isoFromDay),
  };
}

export async function degreeDaysForPeriod(actor: Actor, q: { station: string; start: string; end: string; base: number; unit: TemperatureUnit }) {
  const station = await stationByCode(actor, q.station);
  const w = await stationWeather(station.id);
  const s = dayFromIso(q.start);
  const e = dayFromIso(q.end);
  if (s === null || e === null) throw errors.badRequest('start and end must be real dates');
  if (!w) throw errors.unprocessable(`Station ${q.station} has no temperatures yet.`);
  const hdd = periodDegreeDays(w.table, 'hdd', q.base, s, e, { unit: q.unit, minCoverage: 0 });
  const cdd = periodDegreeDays(w.table, 'cdd', q.base, s, e, { unit: q.unit, minCoverage: 0 });
  const normalH = normalYearDegreeDays(w.table, 'hdd', q.base, { unit: q.unit });
  const normalC = normalYearDegreeDays(w.table, 'cdd', q.base, { unit: q.unit });
  const pack = (r: typeof hdd) => (r.ok ? { total: r.total, perDay: r.perDay } : { total: null, perDay: null });
  return {
    station: q.station,
    start: q.start,
    end: q.end,
    base: q.base,
    unit: q.unit,
    days: e - s + 1,
    daysWithTemperature: hdd.daysWithData,
    coverage: hdd.coverage,
    // CalTRACK 2.0 §2.2.3.2: a bill period needs temperature on at least 90 % of its days.
    sufficient: hdd.coverage >= 0.9,
    hdd: pack(hdd),
    cdd: pack(cdd),
    normalYear: {
      hdd: normalH.ok ? normalH.value : null,
      cdd: normalC.ok ? normalC.value : null,
      years: normalH.ok ? normalH.yearsUsed.length : 0,
      firstYear: normalH.ok ? normalH.yearsUsed[0] : null,
      lastYear: normalH.ok ? normalH.yearsUsed.at(-1) : null,
    },
  };
}

/** HDD and CDD per month of a calendar year at a base, beside the station's normal year by month. */
export async function monthlyDegreeDays(actor: Actor, q: { station: string; year: number; base: number; unit: TemperatureUnit }) {
  const station = await stationByCode(actor, q.station);
  const w = await stationWeather(station.id);
  if (!w) return { months: [], normal: null };
  const months = Array.from({ length: 12 }, (_, k) => {
    const s = dayFromCivil(q.year, k + 1, 1);
    const e = s + daysInMonth(q.year, k + 1) - 1;
    const h = periodDegreeDays(w.table, 'hdd', q.base, s, e, { unit: q.unit, minCoverage: 0 });
    const c = periodDegreeDays(w.table, 'cdd', q.base, s, e, { unit: q.unit, minCoverage: 0 });
    return { month: k + 1, hdd: h.ok ? h.total : null, cdd: c.ok ? c.total : null, coverage: h.coverage };
  });
  const normalH = normalYearDegreeDays(w.table, 'hdd', q.base, { unit: q.unit });
  const normalC = normalYearDegreeDays(w.table, 'cdd', q.base, { unit: q.unit });
  const normalMonths = normalH.ok
    ? Array.from({ length: 12 }, (_, k) => {
        let hs = 0;
        let cs = 0;
        for (const y of normalH.yearsUsed) {
          const s = dayFromCivil(y, k + 1, 1);
          const e = s + daysInMonth(y, k + 1) - 1;
          hs += degreeDaySum(w.table, 'hdd', q.base, s, e, q.unit);
          cs += degreeDaySum(w.table, 'cdd', q.base, s, e, q.unit);
        }
        return { month: k + 1, hdd: hs / normalH.yearsUsed.length, cdd: cs / normalH.yearsUsed.length };
      })
    : null;
  return {
    months,
    normal: normalH.ok && normalC.ok ? { hdd: normalH.value, cdd: normalC.value, years: normalH.yearsUsed, fewYears: normalH.fewYears, months: normalMonths } : null,
  };
}

export async function linkStation(actor: Actor, stationCode: string, installationCode: string) {
  const station = await writableStation(actor, stationCode);
  const db = await getDb();
  const inst = await installationByCode(db, actor, installationCode);
  await db.insert(installationStation).values({ installationId: inst.id, stationId: station.id, primary: false }).onConflictDoNothing();
}
