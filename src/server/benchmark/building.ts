/**
 * One building's performance for its page: intensities against the national peers (CBECS 2018)
 * and its regional peers of the same use type, monthly use and cost (from bills, spread evenly
 * over their days) beside what the baseline expects for each month's weather, and its rank.
 */
import { and, eq, sql } from 'drizzle-orm';
import { calendarizeMonthly } from '../../lib/bills';
import { nationalPeer, quartilePosition } from '../../lib/benchmark/peers';
import { peerPercentiles } from '../../lib/benchmark/peers-percentile';
import { isEnergyCommodity, type Commodity, type Unit, type UseType } from '../../lib/domain';
import { conversionFactor, meterHeatContent } from '../../lib/units/convert';
import { getDb, queryRows } from '../../db/client';
import { building, buildingMetric } from '../../db/schema';
import { scopeToInstallations, type Actor } from '../authz';
import { shortlistEntry } from './shortlist';

export interface MonthRow {
  month: string;
  byCommodity: Partial<Record<Commodity, number>>;
  costUsd: number;
  expectedKbtu: number | null;
}

export async function buildingPerformance(actor: Actor, buildingId: string) {
  const db = await getDb();
  const [me] = await db
    .select({ useType: building.useType, metric: buildingMetric })
    .from(building)
    .leftJoin(buildingMetric, eq(buildingMetric.buildingId, building.id))
    .where(and(eq(building.id, buildingId), scopeToInstallations(actor, building.installationId)));
  if (!me) return null;
  const m = me.metric;
  const peer = nationalPeer(me.useType as UseType);
  const eui = m?.euiNormalized ?? m?.siteEui ?? null;
  const peers = await queryRows<{ id: string; eui: number | null }>(
    db,
    sql`select b.id, coalesce(m.eui_normalized, m.site_eui) as eui from building b join building_metric m on m.building_id = b.id
         where b.use_type = ${me.useType} and not b.archived ${actor.scoped ? sql`and ${scopeToInstallations(actor, sql`b.installation_id`)}` : sql``}`,
  );
  const pct = peerPercentiles(peers.map((p) => ({ id: p.id, group: me.useType, value: p.eui }))).get(buildingId);

  // Monthly use and cost per commodity, and what the baselines expect for each month.
  const meters = await queryRows<{ id: string; commodity: Commodity; unit: Unit; heat: number | null }>(db, sql`select id, commodity, unit, heat_content_kbtu_per_unit as heat from meter where building_id = ${buildingId} and active`);
  const bills = await queryRows<{ m: string; s: number; e: number; q: number; u: Unit; c: number | null }>(
    db,
    sql`select meter_id as m, (period_start - date '1970-01-01')::int as s, (period_end - date '1970-01-01')::int as e, quantity as q, unit as u, cost as c
          from bill where meter_id = any(${sql.param(meters.map((x) => x.id))}::uuid[])`,
  );
  const fits = await queryRows<{ meter_id: string; rows: { start: string; end: string; days: number; predictedUsePerDay: number }[] | null; unit: Unit }>(
    db,
    sql`select meter_id, fit->'periods'->'rows' as rows, unit from baseline where building_id = ${buildingId} and shape is not null`,
  );
  const months = new Map<string, MonthRow>();
  const row = (y: number, mo: number) => {
    const key = `${y}-${String(mo).padStart(2, '0')}`;
    let r = months.get(key);
    if (!r) months.set(key, (r = { month: key, byCommodity: {}, costUsd: 0, expectedKbtu: null }));
    return r;
  };
  for (const mt of meters) {
    const mine = bills.filter((b) => b.m === mt.id);
    const toBase = (u: Unit) => {
      const f = conversionFactor(mt.commodity, u, meterHeatContent(mt.commodity, mt.unit, mt.heat));
      return f.ok ? f.perUnit : 0;
    };
    for (const t of calendarizeMonthly(mine.map((b) => ({ startDay: b.s, endDay: b.e, quantity: b.q * toBase(b.u) })))) {
      const r = row(t.year, t.month);
      r.byCommodity[mt.commodity] = (r.byCommodity[mt.commodity] ?? 0) + t.quantity;
    }
    for (const t of calendarizeMonthly(mine.map((b) => ({ startDay: b.s, endDay: b.e, quantity: b.c })))) row(t.year, t.month).costUsd += t.quantity;
    const fit = fits.find((f) => f.meter_id === mt.id);
    if (fit?.rows && isEnergyCommodity(mt.commodity)) {
      const k = toBase(fit.unit);
      const day = (iso: string) => Math.round(Date.parse(`${iso}T00:00:00Z`) / 86_400_000);
      for (const t of calendarizeMonthly(fit.rows.map((p) => ({ startDay: day(p.start), endDay: day(p.end), quantity: p.predictedUsePerDay * p.days * k })))) {
        const r = row(t.year, t.month);
        r.expectedKbtu = (r.expectedKbtu ?? 0) + t.quantity;
      }
    }
  }
  return {
    metric: m,
    peer: { activity: peer.row.activity, median: peer.row.median, p25: peer.row.p25, p75: peer.row.p75, match: peer.match, position: eui !== null ? quartilePosition(eui, peer) : null },
    regional: pct && pct.ok ? { percentile: pct.percentile, n: pct.n } : null,
    months: [...months.values()].sort((a, b) => a.month.localeCompare(b.month)),
    rank: await shortlistEntry(actor, buildingId),
  };
}
