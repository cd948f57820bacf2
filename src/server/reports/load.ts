/**
 * Loads one walkthrough as a report (src/lib/reports): the walkthrough inside the actor's
 * installations (the scope is in the WHERE clause, so a walkthrough outside it is simply not
 * found), its building and installation, auditor, photos, findings and measures, the building's
 * benchmark figures and baselines. Reads the tables directly; the builders never touch the database.
 */
import { and, asc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { nationalPeer } from '../../lib/benchmark/peers';
import { COMMODITIES, UNITS, type Commodity, type Unit, type UseType } from '../../lib/domain';
import { DEFAULT_DISCOUNT_RATE_SETTING, discountRateSettingSchema } from '../../lib/economics';
import { FINDING_CATEGORIES, PHOTO_TAGS, walkthroughFormSchema } from '../../lib/field/walkthrough-form';
import { computeReportEconomics, readStoredEconomics, walkthroughReportSchema, type ReportMeasure, type WalkthroughReport } from '../../lib/reports';
import { getDb } from '../../db/client';
import { baseline, building, buildingMetric, finding, installation, measure, meter, photo, user, walkthrough } from '../../db/schema';
import { scopeToInstallations, type Actor } from '../authz';
import { getSetting } from '../settings';

/** The setting key the discount rate is stored under (the economics setting of the measures). */
export const DISCOUNT_RATE_SETTING_KEY = 'discount-rate';

const savingsSchema = z.array(z.object({ commodity: z.enum(COMMODITIES), quantity: z.number().finite(), unit: z.string() }));

/** Where the walkthrough and its building are, for the route's file name and the activity log. */
export interface LoadedReport {
  report: WalkthroughReport;
  installationId: string;
  /** Stored file names of the photos, by photo id (for the PDF to read them from disk). */
  photoFiles: Map<string, string>;
}

const oneOf = <T extends string>(list: readonly T[], v: string, fallback: T): T => ((list as readonly string[]).includes(v) ? (v as T) : fallback);
const isoDay = (d: Date | null): string | null => (d ? d.toISOString().slice(0, 10) : null);

/** The report of walkthrough `id`, or null when there is none the actor may see. */
export async function loadWalkthroughReport(actor: Actor, id: string, now = new Date()): Promise<LoadedReport | null> {
  const db = await getDb();
  const [w] = await db
    .select({ w: walkthrough, b: building, i: installation, auditorName: user.name, auditorEmail: user.email })
    .from(walkthrough)
    .innerJoin(building, eq(building.id, walkthrough.buildingId))
    .innerJoin(installation, eq(installation.id, walkthrough.installationId))
    .leftJoin(user, eq(user.id, walkthrough.auditorId))
    .where(and(eq(walkthrough.id, id), scopeToInstallations(actor, walkthrough.installationId)));
  if (!w) return null;

  const scope = scopeToInstallations(actor, finding.installationId);
  const findings = await db.select().from(finding).where(and(eq(finding.walkthroughId, id), scope)).orderBy(asc(finding.createdAt), asc(finding.id));
  const measures = await db.select().from(measure).where(and(eq(measure.walkthroughId, id), scopeToInstallations(actor, measure.installationId)));
  const photos = await db.select().from(photo).where(and(eq(photo.walkthroughId, id), scopeToInstallations(actor, photo.installationId))).orderBy(asc(photo.createdAt), asc(photo.id));
  const meters = await db.select({ commodity: meter.commodity, unit: meter.unit, heat: meter.heatContentKbtuPerUnit }).from(meter).where(eq(meter.buildingId, w.b.id));
  const [metric] = await db.select().from(buildingMetric).where(eq(buildingMetric.buildingId, w.b.id));
  const baselines = await db.select().from(baseline).where(eq(baseline.buildingId, w.b.id)).orderBy(asc(baseline.commodity), asc(baseline.unit));
  const { updatedAt: _u, ...rate } = await getSetting(DISCOUNT_RATE_SETTING_KEY, discountRateSettingSchema, DEFAULT_DISCOUNT_RATE_SETTING);

  const heatOf = (commodity: string, unit: string) => meters.find((m) => m.commodity === commodity && m.unit === unit && m.heat !== null)?.heat ?? null;
  const toMeasure = (m: typeof measure.$inferSelect): ReportMeasure => {
    const parsed = savingsSchema.safeParse(m.savings);
    const base: Omit<ReportMeasure, 'economics'> = {
      id: m.id,
      title: m.title,
      status: m.status as ReportMeasure['status'],
      savings: (parsed.success ? parsed.data : []).map((s) => ({ commodity: s.commodity, quantity: s.quantity, unit: s.unit as Unit, kbtuPerUnit: heatOf(s.commodity, s.unit) })),
      annualEnergyCostSavingsUsd: m.annualEnergyCostSavings,
      annualWaterCostSavingsUsd: m.annualWaterCostSavings,
      annualOmCostSavingsUsd: m.annualOmCostSavings,
      installedCostUsd: m.installedCost,
      incentivesUsd: m.incentives,
      lifeYears: m.lifeYears,
      implementedOn: m.implementedOn,
    };
    return { ...base, economics: readStoredEconomics(m.economics) ?? computeReportEconomics(base, rate) };
  };
  const measureOf = new Map(measures.map((m) => [m.findingId, toMeasure(m)]));
  const findingTitle = new Map(findings.map((f) => [f.id, f.title]));
  const peer = nationalPeer(w.b.useType as UseType);
  const form = walkthroughFormSchema.safeParse(w.w.form);

  const report = walkthroughReportSchema.parse({
    generatedAt: now.toISOString(),
    building: {
      id: w.b.id,
      number: w.b.number,
      name: w.b.name,
      installationCode: w.i.code,
      installationName: w.i.name,
      useType: w.b.useType,
      grossAreaFt2: w.b.grossAreaFt2,
      yearBuilt: w.b.yearBuilt,
      occupants: w.b.occupants,
      address: w.i.address || null,
      climate: w.i.climate || null,
    },
    walkthrough: {
      id: w.w.id,
      title: w.w.title,
      plannedOn: w.w.plannedOn,
      completedOn: w.w.status === 'completed' ? isoDay(w.w.completedAt) : null,
      status: w.w.status,
      auditor: w.auditorName ? { name: w.auditorName, email: w.auditorEmail ?? '' } : null,
      // A form that no longer validates (an older version) is reported empty rather than refused.
      form: form.success ? form.data : walkthroughFormSchema.parse({}),
    },
    photos: photos.map((p) => ({ id: p.id, tag: oneOf(PHOTO_TAGS, p.tag, 'other'), caption: p.caption, mime: p.mime, findingTitle: p.findingId ? (findingTitle.get(p.findingId) ?? null) : null })),
    findings: findings.map((f) => ({ id: f.id, title: f.title, category: oneOf(FINDING_CATEGORIES, f.category, 'other'), location: f.location, description: f.description, status: f.status, measure: measureOf.get(f.id) ?? null })),
    benchmark: metric
      ? { windowStart: metric.windowStart, windowEnd: metric.windowEnd, siteEui: metric.siteEui, euiNormalized: metric.euiNormalized, peerMedianEui: peer.row.median, peerGroup: peer.row.activity, peerSource: peer.source }
      : null,
    baselines: baselines
      .filter((b) => (COMMODITIES as readonly string[]).includes(b.commodity) && (UNITS as readonly string[]).includes(b.unit))
      .map((b) => ({
        commodity: b.commodity as Commodity,
        unit: b.unit,
        shape: b.shape,
        parameters: parameterCount(b.shape, b.fit),
        r2: b.r2,
        cvrmse: b.cvrmse,
        status: b.status,
        periodStart: b.periodStart,
        periodEnd: b.periodEnd,
      })),
  });
  return { report, installationId: w.w.installationId, photoFiles: new Map(photos.map((p) => [p.id, p.storedName])) };
}

/**
 * Parameters of the model in use: mean 1, linear 2, heating or cooling 3; heating-cooling 4 when
 * its heating and cooling balance points coincide (one change point), else 5 (ASHRAE Guideline 14).
 */
function parameterCount(shape: string | null, fit: unknown): number | null {
  if (shape === 'mean') return 1;
  if (shape === 'linear') return 2;
  if (shape === 'heating' || shape === 'cooling') return 3;
  if (shape !== 'heating-cooling') return null;
  const hc = (fit as { shapes?: Record<string, { heatingBalanceF?: number; coolingBalanceF?: number }> } | null)?.shapes?.['heating-cooling'];
  if (hc?.heatingBalanceF == null || hc.coolingBalanceF == null) return null;
  return hc.heatingBalanceF === hc.coolingBalanceF ? 4 : 5;
}
