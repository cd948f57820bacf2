/**
 * Roll-up of a walkthrough's measures: annual savings per commodity, site energy (kBtu) and water
 * (gallons), cost savings, installed cost, incentives and the package's simple payback and SIR.
 *
 * Rejected measures and dismissed findings are left out. The package SIR is Σ PV savings ÷ Σ net
 * investment (NIST Handbook 135 §5: present values of independent measures add), given only when
 * every measure's economics were computed at one discount rate. Sums are compensated (Neumaier).
 */
import { compensatedSum } from '../bills/compensated-sum';
import type { Commodity, Unit } from '../domain';
import { conversionFactor, meterHeatContent } from '../units/convert';
import { reportMeasures, type ReportMeasure, type ReportSaving, type WalkthroughReport } from './walkthrough-report';

export interface CommodityTotal {
  commodity: Commodity;
  unit: Unit;
  quantity: number;
}

export interface ReportRollUp {
  measureCount: number;
  byStatus: Record<ReportMeasure['status'], number>;
  savings: CommodityTotal[];
  /** Site energy saved per year, kBtu; savings that cannot be converted are counted in `unconverted`. */
  siteKbtu: number;
  waterGallons: number;
  unconverted: number;
  annualEnergyCostSavingsUsd: number;
  annualWaterCostSavingsUsd: number;
  annualOmCostSavingsUsd: number;
  annualCostSavingsUsd: number;
  installedCostUsd: number;
  incentivesUsd: number;
  netInvestmentUsd: number;
  /** null when the annual savings are not positive. */
  simplePaybackYears: number | null;
  pvSavingsUsd: number | null;
  /** null unless every measure has PV savings at one discount rate and the net investment is positive. */
  sir: number | null;
  discountRatePercent: number | null;
}

/** kBtu (energy) or gallons (water) per unit of one saving line; null when it cannot be converted. */
export function savingFactor(s: ReportSaving): { measure: 'kBtu' | 'gal'; perUnit: number } | null {
  const f = conversionFactor(s.commodity, s.unit, meterHeatContent(s.commodity, s.unit, s.kbtuPerUnit));
  return f.ok ? { measure: f.measure, perUnit: f.perUnit } : null;
}

/** Site kBtu and gallons of a list of savings lines. */
export function convertSavings(savings: readonly ReportSaving[]): { siteKbtu: number; waterGallons: number; unconverted: number } {
  const kbtu: number[] = [];
  const gal: number[] = [];
  let unconverted = 0;
  for (const s of savings) {
    const f = savingFactor(s);
    if (!f) unconverted++;
    else (f.measure === 'kBtu' ? kbtu : gal).push(s.quantity * f.perUnit);
  }
  return { siteKbtu: compensatedSum(kbtu), waterGallons: compensatedSum(gal), unconverted };
}

/** Totals of the report's measures that are not rejected. */
export function rollUpMeasures(report: Pick<WalkthroughReport, 'findings'>): ReportRollUp {
  const all = reportMeasures(report).map((x) => x.measure);
  const byStatus: ReportRollUp['byStatus'] = { proposed: 0, approved: 0, implemented: 0, rejected: 0 };
  for (const m of all) byStatus[m.status]++;
  const ms = all.filter((m) => m.status !== 'rejected');
  const groups = new Map<string, { commodity: Commodity; unit: Unit; values: number[] }>();
  for (const s of ms.flatMap((m) => m.savings)) {
    const key = `${s.commodity}|${s.unit}`;
    const g = groups.get(key) ?? { commodity: s.commodity, unit: s.unit, values: [] };
    g.values.push(s.quantity);
    groups.set(key, g);
  }
  const sum = (pick: (m: ReportMeasure) => number) => compensatedSum(ms.map(pick));
  const energy = sum((m) => m.annualEnergyCostSavingsUsd);
  const water = sum((m) => m.annualWaterCostSavingsUsd);
  const om = sum((m) => m.annualOmCostSavingsUsd);
  const annual = compensatedSum([energy, water, om]);
  const installed = sum((m) => m.installedCostUsd);
  const incentives = sum((m) => m.incentivesUsd);
  const investment = installed - incentives;
  const rates = new Set(ms.map((m) => m.economics?.discountRatePercent ?? null));
  const allPv = ms.length > 0 && ms.every((m) => m.economics?.pvSavingsUsd != null);
  const pv = allPv ? sum((m) => m.economics!.pvSavingsUsd!) : null;
  const oneRate = rates.size === 1 && !rates.has(null) ? [...rates][0]! : null;
  return {
    measureCount: ms.length,
    byStatus,
    savings: [...groups.values()].map((g) => ({ commodity: g.commodity, unit: g.unit, quantity: compensatedSum(g.values) })),
    ...convertSavings(ms.flatMap((m) => m.savings)),
    annualEnergyCostSavingsUsd: energy,
    annualWaterCostSavingsUsd: water,
    annualOmCostSavingsUsd: om,
    annualCostSavingsUsd: annual,
    installedCostUsd: installed,
    incentivesUsd: incentives,
    netInvestmentUsd: investment,
    simplePaybackYears: annual > 0 ? investment / annual : null,
    pvSavingsUsd: pv,
    sir: pv !== null && oneRate !== null && investment > 0 ? pv / investment : null,
    discountRatePercent: oneRate,
  };
}
