/**
 * Verified savings of a building's implemented measures: for each measure and each meter of the
 * commodities it saves, the meter's baseline before the implementation date predicts use at the
 * actual weather after it (src/lib/savings/verified-savings.ts, on the baseline engine). The
 * baseline period, shapes and acceptance thresholds follow the portfolio fits.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import { getDb, queryRows } from '../../db/client';
import { baseline, building, measure, meter } from '../../db/schema';
import { acceptanceThresholdsSchema, DEFAULT_ACCEPTANCE, defaultShapesFor, packDailyMeans, type Acceptance, type DailyTemperatures, type FittedModel, type Shape } from '../../lib/baseline';
import type { Commodity, Unit } from '../../lib/domain';
import { conversionFactor, meterHeatContent } from '../../lib/units/convert';
import type { SavingsLine } from '../../lib/savings/measure-input';
import { verifiedSavings, type VerifiedSavings } from '../../lib/savings/verified-savings';
import { scopeToInstallations, type Actor } from '../authz';
import { DEFAULT_WINDOW_DAYS } from '../baselines/run';
import { errors } from '../http';
import { getSetting } from '../settings';

export interface VerifiedLine {
  measureId: string;
  measureTitle: string;
  implementedOn: string;
  commodity: Commodity;
  meterId: string;
  meterCode: string;
  unit: Unit;
  /** The measure's own annual estimate for this commodity, in the meter's unit; null when it gave none or the unit does not convert. */
  estimatedAnnual: number | null;
  /** Meters of this commodity in the building the estimate is spread over. */
  metersOfCommodity: number;
  result: VerifiedSavings;
}

async function stationTemperatures(installationId: string): Promise<DailyTemperatures | null> {
  const db = await getDb();
  const days = await queryRows<{ d: number; x: number | null; n: number | null }>(
    db,
    sql`select (w.date - date '1970-01-01')::int as d, w.tmax_f as x, w.tmin_f as n from weather_day w
         where w.station_id = (select s.station_id from installation_station s where s.installation_id = ${installationId} order by s.is_primary desc limit 1)
         order by w.date`,
  );
  if (days.length === 0) return null;
  const first = days[0]!.d;
  const meanF = new Float64Array(days[days.length - 1]!.d - first + 1).fill(Number.NaN);
  for (const r of days) if (r.x !== null && r.n !== null && r.n <= r.x) meanF[r.d - first] = (r.x + r.n) / 2;
  return packDailyMeans(first, meanF);
}

/** Verified savings of every implemented measure of a building in the actor's scope. @throws 404 */
export async function buildingVerifiedSavings(actor: Actor, buildingId: string): Promise<{ lines: VerifiedLine[]; measuresWithoutCommodity: { id: string; title: string }[]; noWeather: boolean }> {
  const db = await getDb();
  const [b] = await db.select({ id: building.id, installationId: building.installationId }).from(building).where(and(eq(building.id, buildingId), scopeToInstallations(actor, building.installationId)));
  if (!b) throw errors.notFound('No such building in your installations.');
  const measures = await db
    .select({ id: measure.id, title: measure.title, implementedOn: measure.implementedOn, savings: measure.savings })
    .from(measure)
    .where(and(eq(measure.buildingId, buildingId), eq(measure.status, 'implemented')))
    .orderBy(asc(measure.implementedOn));
  if (measures.length === 0) return { lines: [], measuresWithoutCommodity: [], noWeather: false };
  const meters = await db.select().from(meter).where(and(eq(meter.buildingId, buildingId), eq(meter.active, true))).orderBy(asc(meter.code));
  const baselines = await db.select({ meterId: baseline.meterId, periodStart: baseline.periodStart, periodEnd: baseline.periodEnd, overrideShape: baseline.overrideShape, fit: baseline.fit }).from(baseline).where(eq(baseline.buildingId, buildingId));
  const temps = await stationTemperatures(b.installationId);
  const { updatedAt: _u, ...acceptance } = await getSetting('baseline-acceptance', acceptanceThresholdsSchema, DEFAULT_ACCEPTANCE);
  const billsCache = new Map<string, { startDay: number; endDay: number; quantity: number; unit: Unit; estimated: boolean }[]>();
  const billsOf = async (meterId: string) => {
    if (!billsCache.has(meterId)) {
      billsCache.set(
        meterId,
        await queryRows(
          db,
          sql`select (period_start - date '1970-01-01')::int as "startDay", (period_end - date '1970-01-01')::int as "endDay", quantity, unit, estimated
                from bill where meter_id = ${meterId} order by period_start`,
        ),
      );
    }
    return billsCache.get(meterId)!;
  };

  const lines: VerifiedLine[] = [];
  const without: { id: string; title: string }[] = [];
  for (const m of measures) {
    const saved = (Array.isArray(m.savings) ? m.savings : []) as SavingsLine[];
    if (saved.length === 0) without.push({ id: m.id, title: m.title });
    for (const s of saved) {
      const ofCommodity = meters.filter((mt) => mt.commodity === s.commodity);
      for (const mt of ofCommodity) {
        const heat = meterHeatContent(mt.commodity as Commodity, mt.unit as Unit, mt.heatContentKbtuPerUnit ?? undefined);
        const from = conversionFactor(s.commodity, s.unit, heat);
        const to = conversionFactor(s.commodity, mt.unit as Unit, heat);
        const bl = baselines.find((x) => x.meterId === mt.id);
        const fit = (bl?.fit ?? {}) as { ok?: boolean; selected?: FittedModel; acceptance?: Acceptance };
        const shapes: Shape[] = bl?.overrideShape ? [bl.overrideShape as Shape] : defaultShapesFor(mt.commodity as Commodity);
        const result: VerifiedSavings = temps
          ? verifiedSavings({
              implementedOn: m.implementedOn!,
              bills: await billsOf(mt.id),
              commodity: mt.commodity as Commodity,
              unit: mt.unit as Unit,
              heat,
              temps,
              stored: bl && fit.ok ? { periodStart: bl.periodStart, periodEnd: bl.periodEnd, model: fit.selected ?? null, acceptance: fit.acceptance ?? null } : null,
              shapes,
              acceptance,
              windowDays: DEFAULT_WINDOW_DAYS,
            })
          : { ok: false, reason: 'baseline-failed', detail: 'no weather station with temperatures for this installation' };
        lines.push({
          measureId: m.id,
          measureTitle: m.title,
          implementedOn: m.implementedOn!,
          commodity: s.commodity,
          meterId: mt.id,
          meterCode: mt.code,
          unit: mt.unit as Unit,
          estimatedAnnual: from.ok && to.ok ? (s.quantity * from.perUnit) / to.perUnit : null,
          metersOfCommodity: ofCommodity.length,
          result,
        });
      }
    }
  }
  return { lines, measuresWithoutCommodity: without, noWeather: temps === null };
}
