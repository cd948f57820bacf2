/**
 * The metrics job: per building, the 12-month and fiscal-year figures from bills (site energy,
 * water, cost, coverage), the weather-normalized EUI from the baselines, source energy and
 * greenhouse gases with the editable factors, and the priority inputs (year-over-year change in
 * normalized use, recent anomalies). Stored in building_metric for the board, shortlist and
 * targets to read at once. Runs after every baseline run.
 */
import { sql } from 'drizzle-orm';
import { sumOverWindow, type BillRow } from '../../lib/bills';
import { fiscalYearWindow } from '../../lib/benchmark/windows';
import { isEnergyCommodity, type Commodity, type Unit } from '../../lib/domain';
import { conversionFactor, meterHeatContent } from '../../lib/units/convert';
import { ASHRAE_105_2021_RATIOS, sourceKbtu, sourceSiteRatiosSchema } from '../../lib/units/source-energy';
import { DEFAULT_GHG_FACTORS, ghgFactorsSchema, ghgKgCo2e } from '../../lib/units/emissions';
import { dayFromIso, isoFromDay, civilFromDay, dayFromCivil, daysInMonth } from '../../lib/weather/day-number';
import { bulkInsert } from '../../db/bulk';
import { getDb, queryRows } from '../../db/client';
import { getSetting } from '../settings';

/** Recent bill periods tested for anomalies (the last six months of the baseline). */
export const ANOMALY_PERIODS = 6;

interface MeterInfo {
  id: string;
  building: string;
  commodity: Commodity;
  unit: Unit;
  heat: number | null;
}

interface FitRow {
  start: string;
  end: string;
  days: number;
  usePerDay: number;
  predictedUsePerDay: number;
}

/** The last complete calendar month before `asOf`: the 12-month window ends there. */
export function rollingWindowEnding(asOfIso: string): { fromDay: number; toDay: number } {
  const c = civilFromDay(dayFromIso(asOfIso)!);
  const endMonth = c.month === 1 ? { y: c.year - 1, m: 12 } : { y: c.year, m: c.month - 1 };
  const toDay = dayFromCivil(endMonth.y, endMonth.m, daysInMonth(endMonth.y, endMonth.m));
  const start = endMonth.m === 12 ? { y: endMonth.y, m: 1 } : { y: endMonth.y - 1, m: endMonth.m + 1 };
  return { fromDay: dayFromCivil(start.y, start.m, 1), toDay };
}

function heatOf(m: MeterInfo) {
  return meterHeatContent(m.commodity, m.unit, m.heat);
}

/**
 * Weather-normalized use of the last 12 months and of the 12 before, from a fit's periods: the
 * normal-year use scaled by how actual use compared with the model in each year.
 */
function yearOverYear(rows: FitRow[], nac: number): { current: number; previous: number } | null {
  if (rows.length === 0) return null;
  const last = dayFromIso(rows[rows.length - 1]!.end)!;
  const ratio = (from: number, to: number) => {
    let a = 0;
    let p = 0;
    for (const r of rows) {
      const mid = (dayFromIso(r.start)! + dayFromIso(r.end)!) / 2;
      if (mid < from || mid > to) continue;
      a += r.usePerDay * r.days;
      p += r.predictedUsePerDay * r.days;
    }
    return p > 0 ? a / p : null;
  };
  const cur = ratio(last - 364, last);
  const prev = ratio(last - 729, last - 365);
  return cur === null || prev === null ? null : { current: nac * cur, previous: nac * prev };
}

export async function computeBuildingMetrics(scope: { installationIds?: string[] } = {}, asOf = new Date().toISOString().slice(0, 10)): Promise<{ buildings: number; seconds: number }> {
  const started = Date.now();
  const db = await getDb();
  const where = scope.installationIds ? sql`b.installation_id = any(${sql.param(scope.installationIds)}::uuid[])` : sql`true`;
  const buildings = await queryRows<{ id: string; installation_id: string; area: number }>(db, sql`select b.id, b.installation_id, b.gross_area_ft2 as area from building b where not b.archived and ${where}`);
  if (buildings.length === 0) return { buildings: 0, seconds: 0 };
  const ids = buildings.map((b) => b.id);
  const meters = await queryRows<MeterInfo>(db, sql`select id, building_id as building, commodity, unit, heat_content_kbtu_per_unit as heat from meter where active and building_id = any(${sql.param(ids)}::uuid[])`);
  const bills = await queryRows<{ m: string; s: number; e: number; q: number; u: Unit; c: number | null }>(
    db,
    sql`select bill.meter_id as m, (period_start - date '1970-01-01')::int as s, (period_end - date '1970-01-01')::int as e, quantity as q, bill.unit as u, cost as c
          from bill join meter on meter.id = bill.meter_id where meter.building_id = any(${sql.param(ids)}::uuid[])`,
  );
  const baselines = await queryRows<{ meter_id: string; status: string; nac_converted: number | null; cvrmse: number | null; rows: FitRow[] | null; rmse: number | null }>(
    db,
    sql`select meter_id, status, nac_converted, cvrmse, fit->'periods'->'rows' as rows, (fit->'selected'->'quality'->>'rmse')::float8 as rmse
          from baseline where building_id = any(${sql.param(ids)}::uuid[]) and shape is not null`,
  );
  const { updatedAt: _r, ...ratios } = await getSetting('source-site-ratios', sourceSiteRatiosSchema, ASHRAE_105_2021_RATIOS);
  const { updatedAt: _g, ...ghgFactors } = await getSetting('ghg-factors', ghgFactorsSchema, DEFAULT_GHG_FACTORS);

  const billsByMeter = new Map<string, { kq: BillRow[]; cost: BillRow[]; last: number }>();
  const meterById = new Map(meters.map((m) => [m.id, m]));
  const factorCache = new Map<string, number | null>();
  for (const b of bills) {
    const m = meterById.get(b.m);
    if (!m) continue;
    const key = `${m.id}|${b.u}`;
    if (!factorCache.has(key)) {
      const f = conversionFactor(m.commodity, b.u, heatOf(m));
      factorCache.set(key, f.ok ? f.perUnit : null);
    }
    const f = factorCache.get(key);
    let e = billsByMeter.get(b.m);
    if (!e) billsByMeter.set(b.m, (e = { kq: [], cost: [], last: -Infinity }));
    e.last = Math.max(e.last, b.e);
    if (f === null || f === undefined) continue;
    e.kq.push({ startDay: b.s, endDay: b.e, quantity: b.q * f });
    e.cost.push({ startDay: b.s, endDay: b.e, quantity: b.c });
  }
  const baselineByMeter = new Map(baselines.map((b) => [b.meter_id, b]));
  const metersByBuilding = new Map<string, MeterInfo[]>();
  for (const m of meters) {
    let list = metersByBuilding.get(m.building);
    if (!list) metersByBuilding.set(m.building, (list = []));
    list.push(m);
  }

  const rolling = rollingWindowEnding(asOf);
  const windowDays = rolling.toDay - rolling.fromDay + 1;
  const asOfFy = civilFromDay(dayFromIso(asOf)!).month >= 10 ? civilFromDay(dayFromIso(asOf)!).year + 1 : civilFromDay(dayFromIso(asOf)!).year;
  const fys = Array.from({ length: 6 }, (_, k) => asOfFy - 5 + k);

  const out: Record<string, unknown>[] = [];
  for (const b of buildings) {
    const ms = metersByBuilding.get(b.id) ?? [];
    const site: Partial<Record<Commodity, number>> = {};
    const commodities: Record<string, unknown> = {};
    let siteKbtu = 0;
    let energyCost = 0;
    let totalCost = 0;
    let waterGal: number | null = null;
    let coverage = 1;
    let anyEnergy = false;
    let nacKbtu = 0;
    let nacU2 = 0;
    let nacAll = true;
    let provisional = false;
    let yoyCur = 0;
    let yoyPrev = 0;
    let yoyAll = true;
    let anomalyPeriods = 0;
    let anomalyBeyond = 0;
    const years: Record<number, { siteKbtu: number; waterGal: number; costUsd: number; coverage: number }> = {};
    for (const m of ms) {
      const e = billsByMeter.get(m.id);
      const q = e ? sumOverWindow(e.kq, rolling) : null;
      const c = e ? sumOverWindow(e.cost, rolling) : null;
      const amount = q && q.ok ? q.total : 0;
      const share = q && q.ok ? q.coveredDays / windowDays : 0;
      coverage = Math.min(coverage, share);
      const cost = c && c.ok ? c.total : 0;
      totalCost += cost;
      const bl = baselineByMeter.get(m.id);
      commodities[m.id] = { commodity: m.commodity, amount, coverage: share, cost, lastBillEnd: e && Number.isFinite(e.last) ? isoFromDay(e.last) : null, baseline: bl?.status ?? null };
      for (const fy of fys) {
        const w = fiscalYearWindow(fy);
        const win = { fromDay: dayFromIso(w.start)!, toDay: dayFromIso(w.end)! };
        const fq = e ? sumOverWindow(e.kq, win) : null;
        const fc = e ? sumOverWindow(e.cost, win) : null;
        const y = (years[fy] ??= { siteKbtu: 0, waterGal: 0, costUsd: 0, coverage: 1 });
        if (isEnergyCommodity(m.commodity)) y.siteKbtu += fq && fq.ok ? fq.total : 0;
        else y.waterGal += fq && fq.ok ? fq.total : 0;
        y.costUsd += fc && fc.ok ? fc.total : 0;
        y.coverage = Math.min(y.coverage, fq && fq.ok ? fq.coveredDays / (win.toDay - win.fromDay + 1) : 0);
      }
      if (!isEnergyCommodity(m.commodity)) {
        waterGal = (waterGal ?? 0) + amount;
        continue;
      }
      anyEnergy = true;
      siteKbtu += amount;
      energyCost += cost;
      site[m.commodity] = (site[m.commodity] ?? 0) + amount;
      // Normalized EUI: accepted baselines, or those meeting the criteria (then provisional).
      if (bl && bl.nac_converted !== null && (bl.status === 'accepted' || bl.status === 'needs-review')) {
        nacKbtu += bl.nac_converted;
        // Standard uncertainty of a normal-year total from monthly residuals, taken as
        // independent: CV(RMSE) × NAC / √12 (common practice; no autocorrelation correction).
        if (bl.cvrmse !== null) nacU2 += ((bl.cvrmse * bl.nac_converted) / Math.sqrt(12)) ** 2;
        if (bl.status !== 'accepted') provisional = true;
      } else nacAll = false;
      // Year-over-year change and anomalies need a model, not an acceptable one: a change in use is
      // often exactly why a fit fails the criteria.
      if (bl && bl.nac_converted !== null) {
        const yoy = bl.rows ? yearOverYear(bl.rows, bl.nac_converted) : null;
        if (yoy) {
          yoyCur += yoy.current;
          yoyPrev += yoy.previous;
        } else yoyAll = false;
        if (bl.rows && bl.rmse) {
          const recent = bl.rows.slice(-ANOMALY_PERIODS);
          anomalyPeriods += recent.length;
          // A period is anomalous when its use per day exceeds the model by more than 2 standard errors.
          anomalyBeyond += recent.filter((r) => r.usePerDay - r.predictedUsePerDay > 2 * bl.rmse!).length;
        }
      } else yoyAll = false;
    }
    const area = b.area;
    const src = sourceKbtu(site, ratios);
    const ghg = ghgKgCo2e(site, ghgFactors);
    out.push({
      buildingId: b.id,
      installationId: b.installation_id,
      windowStart: isoFromDay(rolling.fromDay),
      windowEnd: isoFromDay(rolling.toDay),
      areaFt2: area,
      siteKbtu: anyEnergy ? siteKbtu : null,
      siteEui: anyEnergy ? siteKbtu / area : null,
      sourceEui: anyEnergy && src.ok ? src.totalKbtu / area : null,
      ghgKgPerFt2: anyEnergy && ghg.ok ? ghg.totalKgCo2e / area : null,
      euiNormalized: anyEnergy && nacAll ? nacKbtu / area : null,
      euiNormalizedUncertainty: anyEnergy && nacAll ? Math.sqrt(nacU2) / area : null,
      normalizedProvisional: provisional,
      waterGal,
      wui: waterGal === null ? null : waterGal / area,
      costUsd: totalCost,
      costIntensity: totalCost / area,
      pricePerKbtu: siteKbtu > 0 ? energyCost / siteKbtu : null,
      coverage: ms.length ? coverage : 0,
      yoyCurrentKbtu: anyEnergy && yoyAll ? yoyCur : null,
      yoyPreviousKbtu: anyEnergy && yoyAll ? yoyPrev : null,
      anomalyPeriods,
      anomalyBeyond,
      commodities,
      years,
    });
  }

  await db.transaction(async (tx) => {
    await tx.execute(sql`delete from building_metric where building_id = any(${sql.param(ids)}::uuid[])`);
    for (let i = 0; i < out.length; i += 2000) {
      const part = out.slice(i, i + 2000);
      const c = (k: string) => part.map((r) => r[k] ?? null);
      await bulkInsert(tx, 'building_metric', [
        { name: 'building_id', type: 'uuid', values: c('buildingId') },
        { name: 'installation_id', type: 'uuid', values: c('installationId') },
        { name: 'window_start', type: 'date', values: c('windowStart') },
        { name: 'window_end', type: 'date', values: c('windowEnd') },
        { name: 'area_ft2', type: 'float8', values: c('areaFt2') },
        { name: 'site_kbtu', type: 'float8', values: c('siteKbtu') },
        { name: 'site_eui', type: 'float8', values: c('siteEui') },
        { name: 'source_eui', type: 'float8', values: c('sourceEui') },
        { name: 'ghg_kg_per_ft2', type: 'float8', values: c('ghgKgPerFt2') },
        { name: 'eui_normalized', type: 'float8', values: c('euiNormalized') },
        { name: 'eui_normalized_uncertainty', type: 'float8', values: c('euiNormalizedUncertainty') },
        { name: 'normalized_provisional', type: 'bool', values: c('normalizedProvisional') },
        { name: 'water_gal', type: 'float8', values: c('waterGal') },
        { name: 'wui', type: 'float8', values: c('wui') },
        { name: 'cost_usd', type: 'float8', values: c('costUsd') },
        { name: 'cost_intensity', type: 'float8', values: c('costIntensity') },
        { name: 'price_per_kbtu', type: 'float8', values: c('pricePerKbtu') },
        { name: 'coverage', type: 'float8', values: c('coverage') },
        { name: 'yoy_current_kbtu', type: 'float8', values: c('yoyCurrentKbtu') },
        { name: 'yoy_previous_kbtu', type: 'float8', values: c('yoyPreviousKbtu') },
        { name: 'anomaly_periods', type: 'int4', values: c('anomalyPeriods') },
        { name: 'anomaly_beyond', type: 'int4', values: c('anomalyBeyond') },
        { name: 'commodities', type: 'jsonb', values: part.map((r) => JSON.stringify(r.commodities)) },
        { name: 'years', type: 'jsonb', values: part.map((r) => JSON.stringify(r.years)) },
      ]);
    }
    // Data freshness per meter.
    await tx.execute(sql`update meter set last_bill_end = x.last from (select meter_id, max(period_end) as last from bill group by meter_id) x
                          where x.meter_id = meter.id and meter.building_id = any(${sql.param(ids)}::uuid[]) and meter.last_bill_end is distinct from x.last`);
  });
  return { buildings: buildings.length, seconds: (Date.now() - started) / 1000 };
}
