/**
 * Reads the economics JSON stored with a measure (measure.economics) into the report's shape.
 * The app stores the result of `measureEconomics.run` with the dated discount-rate setting it was
 * computed at; this reader accepts the value flat or under `result` / `value` (a whole calculator
 * outcome included), and the rate flat or under `rate` / `setting`
 * (`discountRatePercent` or `realDiscountRatePercent`, `effectiveFrom`, `source`).
 * Anything it cannot read gives null, so a report is never built on half-read figures.
 */
import { z } from 'zod';
import { measureEconomics } from '../economics';
import type { DiscountRateSetting } from '../economics';
import type { ReportEconomics, ReportMeasure } from './walkthrough-report';

const num = z.number().finite().nullable().optional();
const valueSchema = z.object({ simplePaybackYears: num, sir: num, airrPercent: num, pvSavingsUsd: num, netSavingsUsd: num });
const rateSchema = z.object({
  discountRatePercent: z.number().finite().optional(),
  realDiscountRatePercent: z.number().finite().optional(),
  effectiveFrom: z.iso.date().optional(),
  source: z.string().optional(),
});

function pickObject(raw: unknown, ...keys: string[]): unknown {
  let cur: unknown = raw;
  for (const k of keys) {
    if (cur === null || typeof cur !== 'object' || !(k in cur)) return undefined;
    cur = (cur as Record<string, unknown>)[k];
  }
  return cur;
}

/** The stored economics, or null when none are stored or they cannot be read. */
export function readStoredEconomics(raw: unknown): ReportEconomics | null {
  const candidates = [raw, pickObject(raw, 'result', 'value'), pickObject(raw, 'result'), pickObject(raw, 'value')];
  const value = candidates.map((c) => valueSchema.safeParse(c)).find((p) => p.success && p.data.pvSavingsUsd != null && (p.data.sir !== undefined || p.data.simplePaybackYears !== undefined));
  if (!value?.success) return null;
  const rates = [raw, pickObject(raw, 'rate'), pickObject(raw, 'setting'), pickObject(raw, 'discountRate')].map((c) => rateSchema.safeParse(c));
  const rate = rates.find((p) => p.success && (p.data.discountRatePercent !== undefined || p.data.realDiscountRatePercent !== undefined));
  const r = rate?.success ? rate.data : null;
  const v = value.data;
  return {
    simplePaybackYears: v.simplePaybackYears ?? null,
    sir: v.sir ?? null,
    airrPercent: v.airrPercent ?? null,
    pvSavingsUsd: v.pvSavingsUsd ?? null,
    netSavingsUsd: v.netSavingsUsd ?? null,
    discountRatePercent: r ? (r.discountRatePercent ?? r.realDiscountRatePercent ?? null) : null,
    rateEffectiveFrom: r?.effectiveFrom ?? null,
    rateSource: r?.source ?? null,
  };
}

/**
 * Economics computed for the report with `measureEconomics` (10 CFR 436, NIST Handbook 135) at
 * the given setting, for a measure whose stored economics cannot be read. Null when the measure's
 * figures are not valid economics input (e.g. incentives above the cost).
 */
export function computeReportEconomics(m: Omit<ReportMeasure, 'economics'>, setting: DiscountRateSetting): ReportEconomics | null {
  const r = measureEconomics.run({
    installedCostUsd: m.installedCostUsd,
    incentivesUsd: m.incentivesUsd,
    annualEnergySavingsUsd: m.annualEnergyCostSavingsUsd,
    annualWaterSavingsUsd: m.annualWaterCostSavingsUsd,
    annualOmSavingsUsd: m.annualOmCostSavingsUsd,
    lifeYears: m.lifeYears,
    discountRatePercent: setting.realDiscountRatePercent,
  });
  if (!r.ok) return null;
  return {
    simplePaybackYears: r.value.simplePaybackYears,
    sir: r.value.sir,
    airrPercent: r.value.airrPercent,
    pvSavingsUsd: r.value.pvSavingsUsd,
    netSavingsUsd: r.value.netSavingsUsd,
    discountRatePercent: setting.realDiscountRatePercent,
    rateEffectiveFrom: setting.effectiveFrom,
    rateSource: setting.source,
  };
}
