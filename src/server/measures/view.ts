/** A measure row as the API shows it, with the economics as stored (and the discount rate used). */
import type { measure } from '../../db/schema';
import type { MeasureEconomicsResult } from '../../lib/economics/measure-economics';
import type { MeasureStatus } from '../../lib/field/walkthrough-form';
import type { SavingsLine } from '../../lib/savings/measure-input';

/** The discount-rate setting an economics figure was computed at. */
export interface RateUsed {
  realDiscountRatePercent: number;
  effectiveFrom: string;
  source: string;
  /** When the setting was last changed in Plumbline; null for the built-in default. */
  setAt: string | null;
}

export interface StoredEconomics {
  computedAt: string;
  rate: RateUsed;
  energyEscalationPercent: number;
  result: MeasureEconomicsResult;
  notes: string[];
}

export interface MeasureView {
  id: string;
  findingId: string;
  walkthroughId: string;
  buildingId: string;
  title: string;
  status: MeasureStatus;
  savings: SavingsLine[];
  annualEnergyCostSavings: number;
  annualWaterCostSavings: number;
  annualOmCostSavings: number;
  installedCost: number;
  incentives: number;
  lifeYears: number;
  economics: StoredEconomics | null;
  approvedBy: string | null;
  approvedAt: string | null;
  implementedOn: string | null;
  updatedAt: string;
}

export function measureView(m: typeof measure.$inferSelect): MeasureView {
  const e = m.economics as Partial<StoredEconomics> | null;
  return {
    id: m.id,
    findingId: m.findingId,
    walkthroughId: m.walkthroughId,
    buildingId: m.buildingId,
    title: m.title,
    status: m.status as MeasureStatus,
    savings: (Array.isArray(m.savings) ? m.savings : []) as SavingsLine[],
    annualEnergyCostSavings: m.annualEnergyCostSavings,
    annualWaterCostSavings: m.annualWaterCostSavings,
    annualOmCostSavings: m.annualOmCostSavings,
    installedCost: m.installedCost,
    incentives: m.incentives,
    lifeYears: m.lifeYears,
    economics: e && e.result && e.rate ? (e as StoredEconomics) : null,
    approvedBy: m.approvedBy,
    approvedAt: m.approvedAt?.toISOString() ?? null,
    implementedOn: m.implementedOn,
    updatedAt: m.updatedAt.toISOString(),
  };
}
