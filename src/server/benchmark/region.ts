/**
 * Installation and region figures from the stored building metrics: intensities (floor-area
 * weighted: Σ use / Σ area of the buildings with data), fiscal-year history against each target
 * path, and data freshness per meter.
 */
import { and, eq, sql } from 'drizzle-orm';
import { installationTargetSchema, projectTrend, targetPath, targetStatus, type InstallationTarget } from '../../lib/benchmark/targets';
import { getDb, queryRows } from '../../db/client';
import { installation } from '../../db/schema';
import { logActivity } from '../activity';
import { installationByCode, scopeToInstallations, type Actor } from '../authz';
import { errors } from '../http';

/** A fiscal year counts toward a target only when bills cover this share of it for every building with data. */
export const FY_MIN_COVERAGE = 0.9;

interface MetricRow {
  installation_id: string;
  code: string;
  name: string;
  climate: string;
  area: number;
  site_kbtu: number | null;
  eui_normalized: number | null;
  water_gal: number | null;
  cost_usd: number | null;
  coverage: number | null;
  years: Record<string, { siteKbtu: number; waterGal: number; costUsd: number; coverage: number }>;
  window_start: string;
  window_end: string;
  target_baseline_fy: number | null;
  target_reduction_pct: number | null;
  target_fy: number | null;
}

export interface InstallationFigures {
  id: string;
  code: string;
  name: string;
  climate: string;
  buildings: number;
  areaFt2: number;
  window: { start: string; end: string } | null;
  siteKbtu: number;
  siteEui: number | null;
  euiNormalized: number | null;
  normalizedAreaShare: number;
  wui: number | null;
  costUsd: number;
  costIntensity: number | null;
  coverage: number | null;
  history: { fy: number; eui: number | null; coverage: number }[];
  target: null | {
    baselineFy: number;
    reductionPct: number;
    targetFy: number;
    baselineEui: number | null;
    targetEui: number | null;
    path: { fy: number; intensity: number }[];
    status: ReturnType<typeof targetStatus> | null;
    projection: ReturnType<typeof projectTrend> | null;
  };
}

export async function installationFigures(actor: Actor): Promise<InstallationFigures[]> {
  const db = await getDb();
  const scope = scopeToInstallations(actor, sql`i.id`);
  const rows = await queryRows<MetricRow>(
    db,
    sql`select i.id as installation_id, i.code, i.name, i.climate, m.area_ft2 as area, m.site_kbtu, m.eui_normalized, m.water_gal, m.cost_usd, m.coverage, m.years,
               m.window_start::text, m.window_end::text, i.target_baseline_fy, i.target_reduction_pct, i.target_fy
          from installation i left join building_metric m on m.installation_id = i.id
         ${scope ? sql`where ${scope}` : sql``}
         order by i.code`,
  );
  const byInst = new Map<string, MetricRow[]>();
  for (const r of rows) {
    let list = byInst.get(r.installation_id);
    if (!list) byInst.set(r.installation_id, (list = []));
    if (r.area !== null) list.push(r);
    else if (list.length === 0) byInst.set(r.installation_id, []);
  }
  const heads = new Map(rows.map((r) => [r.installation_id, r]));
  const out: InstallationFigures[] = [];
  for (const [id, list] of byInst) {
    const h = heads.get(id)!;
    const energy = list.filter((r) => r.site_kbtu !== null);
    const energyArea = energy.reduce((s, r) => s + r.area, 0);
    const norm = list.filter((r) => r.eui_normalized !== null);
    const normArea = norm.reduce((s, r) => s + r.area, 0);
    const water = list.filter((r) => r.water_gal !== null);
    const waterArea = water.reduce((s, r) => s + r.area, 0);
    const area = list.reduce((s, r) => s + r.area, 0);
    const siteKbtu = energy.reduce((s, r) => s + (r.site_kbtu ?? 0), 0);
    const cost = list.reduce((s, r) => s + (r.cost_usd ?? 0), 0);
    const fys = [...new Set(list.flatMap((r) => Object.keys(r.years ?? {}).map(Number)))].sort();
    const history = fys.map((fy) => {
      let kbtu = 0;
      let a = 0;
      let cov = 1;
      for (const r of energy) {
        const y = r.years?.[fy];
        if (!y || y.coverage <= 0) continue;
        kbtu += y.siteKbtu;
        a += r.area;
        cov = Math.min(cov, y.coverage);
      }
      return { fy, eui: a > 0 ? kbtu / a : null, coverage: a > 0 ? cov : 0 };
    });
    let target: InstallationFigures['target'] = null;
    if (h.target_baseline_fy && h.target_reduction_pct && h.target_fy) {
      const base = history.find((x) => x.fy === h.target_baseline_fy && x.coverage >= FY_MIN_COVERAGE);
      const t = base?.eui ? installationTargetSchema.safeParse({ baselineFy: h.target_baseline_fy, baselineIntensity: base.eui, targetReductionPct: h.target_reduction_pct, targetFy: h.target_fy }) : null;
      const complete = history.filter((x) => x.eui !== null && x.coverage >= FY_MIN_COVERAGE && x.fy >= h.target_baseline_fy!);
      const latest = complete[complete.length - 1];
      target = {
        baselineFy: h.target_baseline_fy,
        reductionPct: h.target_reduction_pct,
        targetFy: h.target_fy,
        baselineEui: base?.eui ?? null,
        targetEui: t?.success ? t.data.baselineIntensity * (1 - t.data.targetReductionPct / 100) : null,
        path: t?.success ? targetPath(t.data as InstallationTarget).map((p) => ({ fy: p.fy, intensity: p.intensity })) : [],
        status: t?.success && latest ? targetStatus(t.data, latest.fy, latest.eui!) : null,
        projection: t?.success ? projectTrend(t.data, complete.map((x) => ({ fy: x.fy, intensity: x.eui! }))) : null,
      };
    }
    out.push({
      id,
      code: h.code,
      name: h.name,
      climate: h.climate,
      buildings: list.length,
      areaFt2: area,
      window: list[0] ? { start: list[0].window_start, end: list[0].window_end } : null,
      siteKbtu,
      siteEui: energyArea > 0 ? siteKbtu / energyArea : null,
      euiNormalized: normArea > 0 ? norm.reduce((s, r) => s + r.eui_normalized! * r.area, 0) / normArea : null,
      normalizedAreaShare: energyArea > 0 ? normArea / energyArea : 0,
      wui: waterArea > 0 ? water.reduce((s, r) => s + (r.water_gal ?? 0), 0) / waterArea : null,
      costUsd: cost,
      costIntensity: area > 0 ? cost / area : null,
      coverage: list.length ? list.reduce((s, r) => s + (r.coverage ?? 0) * r.area, 0) / area : null,
      history,
      target,
    });
  }
  return out;
}

/** Meters by how long ago their latest bill ended, per installation, and the stalest meters. */
export async function dataFreshness(actor: Actor, asOf = new Date().toISOString().slice(0, 10)) {
  const db = await getDb();
  const scope = scopeToInstallations(actor, sql`m.installation_id`);
  const rows = await queryRows<{ code: string; current: number; late: number; stale: number; never: number }>(
    db,
    sql`select i.code,
               count(*) filter (where m.last_bill_end >= ${asOf}::date - 45) ::int as current,
               count(*) filter (where m.last_bill_end < ${asOf}::date - 45 and m.last_bill_end >= ${asOf}::date - 100)::int as late,
               count(*) filter (where m.last_bill_end < ${asOf}::date - 100)::int as stale,
               count(*) filter (where m.last_bill_end is null)::int as never
          from meter m join installation i on i.id = m.installation_id
         where m.active ${scope ? sql`and ${scope}` : sql``}
         group by i.code order by i.code`,
  );
  const stalest = await queryRows<{ id: string; code: string; installation: string; building_id: string; building: string; commodity: string; last_bill_end: string | null }>(
    db,
    sql`select m.id, m.code, i.code as installation, b.id as building_id, b.number as building, m.commodity, m.last_bill_end::text
          from meter m join installation i on i.id = m.installation_id join building b on b.id = m.building_id
         where m.active ${scope ? sql`and ${scope}` : sql``}
         order by m.last_bill_end asc nulls first limit 10`,
  );
  return { byInstallation: rows, stalest };
}

export async function setTarget(actor: Actor, code: string, t: { baselineFy: number; reductionPct: number; targetFy: number }, ip = '') {
  const db = await getDb();
  const inst = await installationByCode(db, actor, code);
  if (t.targetFy <= t.baselineFy) throw errors.badRequest('targetFy: must come after the baseline year', [{ field: 'targetFy', message: 'must come after the baseline year' }]);
  await db.update(installation).set({ targetBaselineFy: t.baselineFy, targetReductionPct: t.reductionPct, targetFy: t.targetFy, updatedAt: new Date() }).where(and(eq(installation.id, inst.id)));
  await logActivity({ action: 'target.set', userId: actor.id, actor: actor.email, entityType: 'installation', entityId: inst.id, installationId: inst.id, ip, details: t });
}
