/**
 * Energy and water use intensity of one building over one window (methods §5).
 *
 * - Site EUI, kBtu/ft²·yr = Σ energy commodities' site kBtu in the window / gross floor area.
 * - Weather-normalized EUI = Σ energy commodities' normalized annual consumption (NAC, kBtu) / area.
 * - WUI, gal/ft²·yr = water gallons / area. Cost intensity, $/ft²·yr = Σ cost / area (all
 *   utilities), and the energy cost index (energy commodities only; ASHRAE 211 PEA term).
 * - Source EUI = Σ site kBtu × source-site ratio / area; GHG intensity = Σ site kBtu × kg CO2e/kBtu
 *   / area, with per-commodity factors the caller supplies (the published, user-editable sets
 *   live with the unit conversions); a commodity without a factor is reported as missing.
 *
 * Windows are one year long (./windows.ts), so a window total is an annual figure. Each figure
 * carries the share of its window covered by bills (covered days / window days per commodity; the
 * figure's `coverage` is the lowest share among the commodities it sums). A partly covered window
 * is annualized (quantity × window days / covered days) only when `annualize` is asked for, and the
 * figure then says so. Sums use compensated (Kahan–Babuška) summation.
 */
import { z } from 'zod';
import { sum } from 'simple-statistics';
import { commoditySchema, isEnergyCommodity, type Commodity } from '../domain';
import type { Window } from './windows';

export const commodityUseSchema = z.object({
  commodity: commoditySchema,
  /** Site kBtu for energy commodities, gallons for water, within the window. */
  quantity: z.number(),
  costUsd: z.number().nullish(),
  /** Days of the window covered by this commodity's bills (see coveredDays in ./windows.ts). */
  coveredDays: z.number().int().min(0),
  /** Normalized annual consumption from the accepted baseline, kBtu/yr (energy only). */
  normalizedAnnualKbtu: z.number().nullish(),
  /** Standard uncertainty of that NAC, kBtu/yr (e.g. from the baseline's CV(RMSE)). */
  normalizedUncertaintyKbtu: z.number().min(0).nullish(),
});
export type CommodityUse = z.infer<typeof commodityUseSchema>;

export const buildingUsageSchema = z.object({
  buildingId: z.string().min(1),
  areaFt2: z.number().positive(),
  uses: z.array(commodityUseSchema),
});
export type BuildingUsage = z.infer<typeof buildingUsageSchema>;

/** A multiplier per energy commodity applied to site kBtu (a source-site ratio, kg CO2e/kBtu). */
export const commodityFactorsSchema = z.partialRecord(commoditySchema, z.number().min(0));
export type CommodityFactors = Partial<Record<Commodity, number>>;

export type IntensityUnit = 'kBtu/ft²·yr' | 'gal/ft²·yr' | '$/ft²·yr' | 'kg CO2e/ft²·yr';

export type Figure =
  | {
      readonly ok: true;
      readonly value: number;
      readonly unit: IntensityUnit;
      /** Numerator (kBtu, gal, $ or kg CO2e per year) and denominator, for aggregation. */
      readonly total: number;
      readonly areaFt2: number;
      /** Lowest covered share among the summed commodities, 0–1. */
      readonly coverage: number;
      readonly coverageByCommodity: Partial<Record<Commodity, number>>;
      readonly annualized: boolean;
      /** Standard uncertainty of `value` (same unit) when every summed commodity gave one. */
      readonly uncertainty: number | null;
      /** Uncertainty of `total`, kept for aggregation. */
      readonly totalUncertainty: number | null;
      /** Commodities with use that the figure could not include (no NAC, no factor). */
      readonly missing: readonly Commodity[];
      readonly notes: readonly string[];
    }
  | {
      readonly ok: false;
      readonly reason: 'no-data' | 'missing-normalized' | 'missing-factor';
      readonly missing: readonly Commodity[];
    };

export interface BuildingIntensity {
  readonly buildingId: string;
  readonly areaFt2: number;
  readonly window: Window;
  readonly siteEui: Figure;
  readonly normalizedEui: Figure;
  readonly wui: Figure;
  readonly costIntensity: Figure;
  readonly energyCostIntensity: Figure;
  readonly sourceEui: Figure | null;
  readonly ghgIntensity: Figure | null;
}

export interface IntensityOptions {
  /** Scale partly covered commodities up to the full window. Off by default. */
  readonly annualize?: boolean;
  /** Source-to-site ratio per commodity; gives `sourceEui`. */
  readonly sourceSiteRatios?: CommodityFactors;
  /** kg CO2e per kBtu of site energy per commodity; gives `ghgIntensity`. */
  readonly ghgKgPerKbtu?: CommodityFactors;
}

interface Term {
  readonly commodity: Commodity;
  readonly amount: number;
  readonly coverage: number;
  readonly uncertainty?: number | null;
  /** Set when the amount was annualized: says from how many days. */
  readonly note?: string | undefined;
}

function share(coveredDays: number, windowDays: number): number {
  return windowDays > 0 ? Math.min(1, Math.max(0, coveredDays / windowDays)) : 0;
}

/** Factor applied to the billed amount: 1, or window days / covered days when annualizing. */
function annualFactor(u: CommodityUse, w: Window, annualize: boolean): number {
  if (!annualize || u.coveredDays >= w.days || u.coveredDays === 0) return 1;
  return w.days / u.coveredDays;
}

function figure(
  terms: readonly Term[],
  unit: IntensityUnit,
  areaFt2: number,
  missing: readonly Commodity[] = [],
): Figure {
  if (terms.length === 0) return { ok: false, reason: 'no-data', missing };
  const total = sum(terms.map((t) => t.amount));
  const byCommodity: Partial<Record<Commodity, number>> = {};
  let coverage = 1;
  const notes: string[] = [];
  for (const t of terms) {
    byCommodity[t.commodity] = Math.min(byCommodity[t.commodity] ?? 1, t.coverage);
    coverage = Math.min(coverage, t.coverage);
    if (t.note !== undefined) notes.push(t.note);
  }
  // Independent commodities: standard uncertainties add in quadrature (GUM, uncorrelated inputs).
  const allHaveU = terms.every((t) => t.uncertainty != null);
  const totalUncertainty = allHaveU
    ? Math.sqrt(sum(terms.map((t) => (t.uncertainty ?? 0) ** 2)))
    : null;
  return {
    ok: true,
    value: total / areaFt2,
    unit,
    total,
    areaFt2,
    coverage,
    coverageByCommodity: byCommodity,
    annualized: notes.length > 0,
    uncertainty: totalUncertainty === null ? null : totalUncertainty / areaFt2,
    totalUncertainty,
    missing,
    notes,
  };
}

/** Figure built from factor-weighted site energy; a commodity without a factor is missing. */
function factored(
  energy: readonly Term[],
  factors: CommodityFactors,
  unit: IntensityUnit,
  areaFt2: number,
): Figure {
  const missing = energy.filter((t) => factors[t.commodity] === undefined).map((t) => t.commodity);
  const terms = energy
    .filter((t) => factors[t.commodity] !== undefined)
    .map((t) => ({ ...t, amount: t.amount * (factors[t.commodity] ?? 0) }));
  if (terms.length === 0 && missing.length > 0) {
    return { ok: false, reason: 'missing-factor', missing };
  }
  return figure(terms, unit, areaFt2, missing);
}

/**
 * All intensities of one building over one window.
 * @example
 * // 1,000,000 kBtu of electricity and gas over 20,000 ft², a full year of bills: EUI 50
 * buildingIntensity({ buildingId: 'b1', areaFt2: 20_000, uses: [...] }, fiscalYearWindow(2024))
 */
export function buildingIntensity(
  usage: BuildingUsage,
  w: Window,
  options: IntensityOptions = {},
): BuildingIntensity {
  const annualize = options.annualize === true;
  const area = usage.areaFt2;
  const energy: Term[] = [];
  const water: Term[] = [];
  const cost: Term[] = [];
  const energyCost: Term[] = [];
  const normalized: Term[] = [];
  const noNac: Commodity[] = [];

  for (const u of usage.uses) {
    const coverage = share(u.coveredDays, w.days);
    const k = annualFactor(u, w, annualize);
    const note =
      k === 1 ? undefined : `${u.commodity} annualized from ${u.coveredDays} of ${w.days} days`;
    const isEnergy = isEnergyCommodity(u.commodity);
    const base = { commodity: u.commodity, coverage, note };
    (isEnergy ? energy : water).push({ ...base, amount: u.quantity * k });
    if (u.costUsd != null) {
      cost.push({ ...base, amount: u.costUsd * k });
      if (isEnergy) energyCost.push({ ...base, amount: u.costUsd * k });
    }
    if (isEnergy && u.normalizedAnnualKbtu != null) {
      normalized.push({
        commodity: u.commodity,
        amount: u.normalizedAnnualKbtu,
        coverage,
        uncertainty: u.normalizedUncertaintyKbtu ?? null,
      });
    } else if (isEnergy && u.quantity !== 0) {
      noNac.push(u.commodity);
    }
  }

  return {
    buildingId: usage.buildingId,
    areaFt2: area,
    window: w,
    siteEui: figure(energy, 'kBtu/ft²·yr', area),
    normalizedEui:
      normalized.length === 0 && noNac.length > 0
        ? { ok: false, reason: 'missing-normalized', missing: noNac }
        : figure(normalized, 'kBtu/ft²·yr', area, noNac),
    wui: figure(water, 'gal/ft²·yr', area),
    costIntensity: figure(cost, '$/ft²·yr', area),
    energyCostIntensity: figure(energyCost, '$/ft²·yr', area),
    sourceEui: options.sourceSiteRatios
      ? factored(energy, options.sourceSiteRatios, 'kBtu/ft²·yr', area)
      : null,
    ghgIntensity: options.ghgKgPerKbtu
      ? factored(energy, options.ghgKgPerKbtu, 'kg CO2e/ft²·yr', area)
      : null,
  };
}

/**
 * Blended energy price from a building's own bills, $/kBtu = Σ energy cost / Σ energy kBtu over
 * the commodities that have both. Null when no energy was billed with a cost.
 */
export function blendedPricePerKbtu(uses: readonly CommodityUse[]): number | null {
  const priced = uses.filter((u) => isEnergyCommodity(u.commodity) && u.costUsd != null);
  const kbtu = sum(priced.map((u) => u.quantity));
  if (!(kbtu > 0)) return null;
  return sum(priced.map((u) => u.costUsd ?? 0)) / kbtu;
}
