/**
 * A measure (ECM) as entered from a finding: annual savings per commodity in its billing unit,
 * annual cost savings (energy, water, O&M), installed cost, incentives and life; and its status
 * path proposed → approved → implemented (dated), or rejected. The economics are computed by
 * `measureEconomics` (10 CFR 436 / NIST Handbook 135) at the discount rate in force.
 */
import { z } from 'zod';
import { COMMODITY_UNITS, commoditySchema, unitSchema } from '../domain';
import type { MeasureEconomicsInput } from '../economics/measure-economics';
import { MEASURE_STATUSES, type MeasureStatus } from '../field/walkthrough-form';

const money = (label: string) => z.number({ error: `${label} must be a number` }).min(-1e10).max(1e10);

export const savingsLineSchema = z
  .object({
    commodity: commoditySchema,
    /** Annual savings in `unit`; negative when the measure adds use of this commodity (fuel switch). */
    quantity: z.number({ error: 'Savings must be a number' }).min(-1e12).max(1e12),
    unit: unitSchema,
  })
  .refine((l) => COMMODITY_UNITS[l.commodity].includes(l.unit), { error: 'This unit does not measure this commodity', path: ['unit'] });
export type SavingsLine = z.output<typeof savingsLineSchema>;

export const measureInputSchema = z.object({
  title: z.string().trim().min(3, { error: 'At least 3 characters' }).max(200).optional(),
  savings: z
    .array(savingsLineSchema)
    .max(12)
    .default([])
    .refine((lines) => new Set(lines.map((l) => l.commodity)).size === lines.length, { error: 'One line per commodity' }),
  annualEnergyCostSavings: money('Annual energy cost savings').default(0),
  annualWaterCostSavings: money('Annual water cost savings').default(0),
  /** Negative when the measure adds operation and maintenance cost. */
  annualOmCostSavings: money('Annual O&M cost savings').default(0),
  installedCost: z.number({ error: 'Installed cost must be a number' }).min(0, { error: 'Installed cost must not be negative' }).max(1e10),
  incentives: z.number({ error: 'Incentives must be a number' }).min(0, { error: 'Incentives must not be negative' }).max(1e10).default(0),
  lifeYears: z.number({ error: 'Life must be a number' }).int({ error: 'Life: whole years' }).min(1, { error: 'Life: at least 1 year' }).max(100),
  /** Real escalation of energy prices (%/yr); 0 keeps prices constant in real terms. */
  energyEscalationPercent: z.number().gt(-50).max(20).default(0),
});
export type MeasureInput = z.output<typeof measureInputSchema>;

/** The economics calculator's input from a measure and the discount rate in force. */
export function economicsInput(m: MeasureInput, discountRatePercent: number): MeasureEconomicsInput {
  return {
    installedCostUsd: m.installedCost,
    incentivesUsd: m.incentives,
    annualEnergySavingsUsd: m.annualEnergyCostSavings,
    annualWaterSavingsUsd: m.annualWaterCostSavings,
    annualOmSavingsUsd: m.annualOmCostSavings,
    lifeYears: m.lifeYears,
    discountRatePercent,
    energyEscalationPercent: m.energyEscalationPercent,
  };
}

/** The economics calculator's field names → the measure's, for error messages on the form. */
export const ECONOMICS_FIELD_NAMES: Record<string, string> = {
  installedCostUsd: 'installedCost',
  incentivesUsd: 'incentives',
  annualEnergySavingsUsd: 'annualEnergyCostSavings',
  annualWaterSavingsUsd: 'annualWaterCostSavings',
  annualOmSavingsUsd: 'annualOmCostSavings',
  lifeYears: 'lifeYears',
  discountRatePercent: 'discountRate',
  energyEscalationPercent: 'energyEscalationPercent',
};

export const MEASURE_STATUS_LABELS: Record<MeasureStatus, string> = {
  proposed: 'Proposed',
  approved: 'Approved',
  implemented: 'Implemented',
  rejected: 'Rejected',
};

/** Allowed moves; backward moves undo a decision (each move is logged). */
export const MEASURE_TRANSITIONS: Record<MeasureStatus, readonly MeasureStatus[]> = {
  proposed: ['approved', 'rejected'],
  approved: ['implemented', 'rejected', 'proposed'],
  implemented: ['approved'],
  rejected: ['proposed'],
};

export function canMoveMeasure(from: MeasureStatus, to: MeasureStatus): boolean {
  return MEASURE_TRANSITIONS[from].includes(to);
}

export const measureStatusChangeSchema = z
  .object({
    status: z.enum(MEASURE_STATUSES),
    implementedOn: z.iso.date({ error: 'A date (YYYY-MM-DD)' }).optional(),
    note: z.string().trim().max(1000).default(''),
  })
  .refine((v) => v.status !== 'implemented' || v.implementedOn !== undefined, { error: 'Give the date it was implemented', path: ['implementedOn'] });
export type MeasureStatusChange = z.output<typeof measureStatusChangeSchema>;
