/**
 * The walkthrough report as plain data: the building, the walkthrough and its field form, photos,
 * findings with their measures and economics, the building's benchmark figures and baselines.
 * A server loader fills it from the database; the builders (BuildingSync XML here, the PDF in
 * src/server/reports) only read it, so the same report gives the same documents.
 *
 * Savings are stated per commodity in the unit the commodity is billed in, as measures store them;
 * `kbtuPerUnit` carries the heat content the building's meter states (gas in ccf) where one exists.
 */
import { z } from 'zod';
import { commoditySchema, unitSchema, useTypeSchema } from '../domain';
import { walkthroughFormSchema, FINDING_CATEGORIES, MEASURE_STATUSES, PHOTO_TAGS, WALKTHROUGH_STATUSES } from '../field/walkthrough-form';

const isoDate = z.iso.date();
const money = z.number().finite();

export const reportSavingSchema = z.object({
  commodity: commoditySchema,
  /** Annual savings in `unit` (negative: the measure adds use of this commodity, e.g. a fuel switch). */
  quantity: z.number().finite(),
  unit: unitSchema,
  /** kBtu per billing unit stated by the building's meter (gas in ccf, steam in Mlb); null when none. */
  kbtuPerUnit: z.number().positive().nullable().default(null),
});
export type ReportSaving = z.output<typeof reportSavingSchema>;

/** The economics as stored with the measure, and the dated discount rate they were computed at. */
export const reportEconomicsSchema = z.object({
  simplePaybackYears: z.number().nullable(),
  sir: z.number().nullable(),
  airrPercent: z.number().nullable(),
  pvSavingsUsd: z.number().nullable(),
  netSavingsUsd: z.number().nullable(),
  discountRatePercent: z.number().nullable(),
  rateEffectiveFrom: isoDate.nullable(),
  rateSource: z.string().nullable(),
});
export type ReportEconomics = z.output<typeof reportEconomicsSchema>;

export const reportMeasureSchema = z.object({
  id: z.string(),
  title: z.string(),
  status: z.enum(MEASURE_STATUSES),
  savings: z.array(reportSavingSchema),
  annualEnergyCostSavingsUsd: money,
  annualWaterCostSavingsUsd: money,
  annualOmCostSavingsUsd: money,
  installedCostUsd: money,
  incentivesUsd: money,
  lifeYears: z.number().int().min(1),
  implementedOn: isoDate.nullable(),
  economics: reportEconomicsSchema.nullable(),
});
export type ReportMeasure = z.output<typeof reportMeasureSchema>;

export const reportFindingSchema = z.object({
  id: z.string(),
  title: z.string(),
  category: z.enum(FINDING_CATEGORIES),
  location: z.string(),
  description: z.string(),
  status: z.enum(['open', 'dismissed']),
  measure: reportMeasureSchema.nullable(),
});
export type ReportFinding = z.output<typeof reportFindingSchema>;

export const reportPhotoSchema = z.object({
  id: z.string(),
  tag: z.enum(PHOTO_TAGS),
  caption: z.string(),
  mime: z.string(),
  /** The title of the finding it illustrates, if any. */
  findingTitle: z.string().nullable().default(null),
});
export type ReportPhoto = z.output<typeof reportPhotoSchema>;

export const reportBaselineSchema = z.object({
  commodity: commoditySchema,
  /** The unit the baseline is fitted in: the meter's billing unit. */
  unit: unitSchema,
  /** Engine shape code (mean, linear, heating, cooling, heating-cooling); null without a model. */
  shape: z.string().nullable(),
  /** Number of model parameters (2–5) when known, to tell a 4- from a 5-parameter model. */
  parameters: z.number().int().min(1).max(5).nullable(),
  r2: z.number().nullable(),
  /** CV(RMSE) as a fraction (0.12 = 12 %). */
  cvrmse: z.number().nullable(),
  status: z.string(),
  periodStart: isoDate.nullable(),
  periodEnd: isoDate.nullable(),
});
export type ReportBaseline = z.output<typeof reportBaselineSchema>;

export const reportBenchmarkSchema = z.object({
  windowStart: isoDate,
  windowEnd: isoDate,
  siteEui: z.number().nullable(),
  euiNormalized: z.number().nullable(),
  /** National peer median site EUI (kBtu/ft²·yr) and the peer group it comes from. */
  peerMedianEui: z.number().nullable(),
  peerGroup: z.string().nullable(),
  peerSource: z.string().nullable(),
});
export type ReportBenchmark = z.output<typeof reportBenchmarkSchema>;

export const walkthroughReportSchema = z.object({
  /** When the report was made (ISO date-time), printed on it. */
  generatedAt: z.string(),
  building: z.object({
    id: z.string(),
    number: z.string(),
    name: z.string(),
    installationCode: z.string(),
    installationName: z.string(),
    useType: useTypeSchema,
    grossAreaFt2: z.number().positive(),
    yearBuilt: z.number().int().nullable(),
    occupants: z.number().int().nullable(),
    address: z.string().nullable(),
    climate: z.string().nullable(),
  }),
  walkthrough: z.object({
    id: z.string(),
    title: z.string(),
    plannedOn: isoDate,
    completedOn: isoDate.nullable(),
    status: z.enum(WALKTHROUGH_STATUSES),
    auditor: z.object({ name: z.string(), email: z.string() }).nullable(),
    form: walkthroughFormSchema,
  }),
  photos: z.array(reportPhotoSchema),
  findings: z.array(reportFindingSchema),
  benchmark: reportBenchmarkSchema.nullable(),
  baselines: z.array(reportBaselineSchema),
});
/** What a report holds once parsed (defaults filled). */
export type WalkthroughReport = z.output<typeof walkthroughReportSchema>;
/** What a caller may pass (defaults optional). */
export type WalkthroughReportInput = z.input<typeof walkthroughReportSchema>;

/** The walkthrough's audit date: the day it was completed, else the day it was planned. */
export function auditDate(report: Pick<WalkthroughReport, 'walkthrough'>): string {
  return report.walkthrough.completedOn ?? report.walkthrough.plannedOn;
}

/** The measures of the report's open findings, in finding order (dismissed findings carry none). */
export function reportMeasures(report: Pick<WalkthroughReport, 'findings'>): { finding: ReportFinding; measure: ReportMeasure }[] {
  return report.findings.flatMap((f) => (f.status === 'open' && f.measure ? [{ finding: f, measure: f.measure }] : []));
}
