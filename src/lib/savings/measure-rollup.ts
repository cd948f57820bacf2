/**
 * Roll-up of a set of measures (a walkthrough's, an installation's): counts by status, and for
 * the measures still in play (not rejected) and for those committed (approved or implemented)
 * the totals of savings per commodity, annual cost savings, cost, and the portfolio's simple
 * payback = Σ net investment ÷ Σ annual net savings, undiscounted as in 10 CFR 436.23.
 * Present values add as they are (each at the rate it was computed with); their ratio is the
 * portfolio SIR (10 CFR 436.21 applied to the bundle). Sums are compensated (Neumaier).
 */
import { compensatedSum } from '../bills/compensated-sum';
import { MEASURE_STATUSES, type MeasureStatus } from '../field/walkthrough-form';
import type { SavingsLine } from './measure-input';

export interface RollupMeasure {
  status: MeasureStatus;
  savings: readonly SavingsLine[];
  annualEnergyCostSavings: number;
  annualWaterCostSavings: number;
  annualOmCostSavings: number;
  installedCost: number;
  incentives: number;
  /** Present value of the savings from the stored economics; null when not computed. */
  pvSavingsUsd: number | null;
}

export interface RollupTotals {
  count: number;
  /** Σ quantity per commodity and unit. */
  savings: SavingsLine[];
  annualCostSavings: { energy: number; water: number; om: number; total: number };
  installedCost: number;
  incentives: number;
  netInvestment: number;
  /** null when the annual net savings are not positive. */
  simplePaybackYears: number | null;
  pvSavingsUsd: number;
  /** null when there is no net investment or a measure has no stored present value. */
  sir: number | null;
}

export interface MeasureRollup {
  count: number;
  byStatus: Record<MeasureStatus, number>;
  /** Proposed, approved and implemented. */
  inPlay: RollupTotals;
  /** Approved and implemented. */
  committed: RollupTotals;
}

function totals(ms: readonly RollupMeasure[]): RollupTotals {
  const lines = new Map<string, SavingsLine & { parts: number[] }>();
  for (const m of ms) {
    for (const l of m.savings) {
      const key = `${l.commodity}|${l.unit}`;
      const e = lines.get(key) ?? { commodity: l.commodity, unit: l.unit, quantity: 0, parts: [] };
      e.parts.push(l.quantity);
      lines.set(key, e);
    }
  }
  const sum = (f: (m: RollupMeasure) => number) => compensatedSum(ms.map(f));
  const energy = sum((m) => m.annualEnergyCostSavings);
  const water = sum((m) => m.annualWaterCostSavings);
  const om = sum((m) => m.annualOmCostSavings);
  const total = compensatedSum([energy, water, om]);
  const installedCost = sum((m) => m.installedCost);
  const incentives = sum((m) => m.incentives);
  const netInvestment = installedCost - incentives;
  const pvKnown = ms.every((m) => m.pvSavingsUsd !== null);
  const pv = sum((m) => m.pvSavingsUsd ?? 0);
  return {
    count: ms.length,
    savings: [...lines.values()].map(({ parts, ...l }) => ({ ...l, quantity: compensatedSum(parts) })).sort((a, b) => a.commodity.localeCompare(b.commodity) || a.unit.localeCompare(b.unit)),
    annualCostSavings: { energy, water, om, total },
    installedCost,
    incentives,
    netInvestment,
    simplePaybackYears: total > 0 ? netInvestment / total : null,
    pvSavingsUsd: pv,
    sir: netInvestment > 0 && pvKnown && ms.length > 0 ? pv / netInvestment : null,
  };
}

/**
 * Roll up measures.
 * @example rollUpMeasures([{ status: 'approved', savings: [], annualEnergyCostSavings: 4000, annualWaterCostSavings: 0,
 *   annualOmCostSavings: 0, installedCost: 12000, incentives: 2000, pvSavingsUsd: null }]).committed.simplePaybackYears // 2.5
 */
export function rollUpMeasures(ms: readonly RollupMeasure[]): MeasureRollup {
  const byStatus = Object.fromEntries(MEASURE_STATUSES.map((s) => [s, 0])) as Record<MeasureStatus, number>;
  for (const m of ms) byStatus[m.status]++;
  return {
    count: ms.length,
    byStatus,
    inPlay: totals(ms.filter((m) => m.status !== 'rejected')),
    committed: totals(ms.filter((m) => m.status === 'approved' || m.status === 'implemented')),
  };
}
