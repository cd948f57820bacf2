/**
 * Economics of an energy or water conservation measure, per 10 CFR 436 Subpart A and NIST
 * Handbook 135, for a measure bought at the start of year 1 with level annual savings:
 *
 * - simple payback = net investment ÷ annual net savings, undiscounted (10 CFR 436.23);
 * - PV savings = energy $ × UPV*(d, e, n) + (water $ + O&M $) × UPV(d, n);
 * - net savings = PV savings − net investment (10 CFR 436.20, no replacement or residual value);
 * - SIR = PV savings ÷ net investment (10 CFR 436.21); SIR > 1 is cost-effective;
 * - AIRR = (1 + d) · SIR^(1/n) − 1 (10 CFR 436.22, reinvestment at d).
 *
 * Net investment is installed cost less incentives (UConn ITAC: ($12,000 − $2,000) / $4,000 =
 * 2.5 years). The real discount rate is bounded 3 %–10 % (10 CFR 436.14).
 *
 * @example
 * measureEconomics.run({ installedCostUsd: 5000, annualEnergySavingsUsd: 1000, lifeYears: 10,
 *   discountRatePercent: 3 })
 * // payback 5 yr, SIR 1.706, AIRR 8.65 %
 */
import { z } from 'zod';
import { type CalcOutcome, optionalStep, parseThenCompute, type SourceCitation, success } from '../field/calculator';
import { numberField } from '../field/inputs';
import { discountRatePercentSchema } from './discount-rate';
import { modifiedUniformPresentValue, singlePresentValue, uniformPresentValue } from './present-value';

export const measureEconomicsInputSchema = z
  .object({
    installedCostUsd: numberField('Installed cost ($)', { min: 0 }),
    incentivesUsd: numberField('Incentives and rebates ($)', { min: 0 }).default(0),
    annualEnergySavingsUsd: numberField('Annual energy cost savings ($/yr)'),
    annualWaterSavingsUsd: numberField('Annual water cost savings ($/yr)').default(0),
    /** Negative when the measure adds operation and maintenance cost. */
    annualOmSavingsUsd: numberField('Annual O&M cost savings ($/yr)').default(0),
    lifeYears: numberField('Life (years)', { int: true, min: 1, max: 100 }),
    discountRatePercent: discountRatePercentSchema,
    /** Real escalation of energy prices above general inflation. */
    energyEscalationPercent: numberField('Energy price escalation (%/yr, real)', { gt: -50, max: 20 }).default(0),
  })
  .refine((v) => v.incentivesUsd <= v.installedCostUsd, {
    error: 'Incentives and rebates ($) must not exceed the installed cost',
    path: ['incentivesUsd'],
  });
export type MeasureEconomicsInput = z.output<typeof measureEconomicsInputSchema>;

export interface MeasureEconomicsResult {
  netInvestmentUsd: number;
  annualNetSavingsUsd: number;
  /** null when the annual net savings are not positive: the measure never pays back. */
  simplePaybackYears: number | null;
  spv: number;
  upv: number;
  /** UPV* for the energy savings; equals UPV when the escalation is 0. */
  upvStarEnergy: number;
  pvSavingsUsd: number;
  netSavingsUsd: number;
  /** null when there is no net investment. */
  sir: number | null;
  /** Percent; null when SIR is null or not positive. */
  airrPercent: number | null;
  costEffective: boolean;
}

export const MEASURE_ECONOMICS_SOURCES: readonly SourceCitation[] = [
  { title: '10 CFR 436 Subpart A, §§ 436.14 (discount rate), 436.20–436.23 (net savings, SIR, AIRR, payback)', publisher: 'U.S. Department of Energy', kind: 'regulation', confidence: 'secondary' },
  { title: 'NIST Handbook 135, Life-Cycle Costing Manual for the Federal Energy Management Program', publisher: 'National Institute of Standards and Technology', kind: 'government', confidence: 'secondary' },
];

export const MEASURE_ECONOMICS_FORMULAS: readonly string[] = [
  'simple payback = (installed cost − incentives) ÷ (energy + water + O&M savings per year)',
  'UPV = [(1 + d)^n − 1] ÷ [d (1 + d)^n];  UPV* = (1 + e) ÷ (d − e) × [1 − ((1 + e) ÷ (1 + d))^n]',
  'PV savings = energy × UPV* + (water + O&M) × UPV',
  'net savings = PV savings − net investment;  SIR = PV savings ÷ net investment',
  'AIRR = (1 + d) × SIR^(1/n) − 1',
];

export function computeMeasureEconomics(input: MeasureEconomicsInput): CalcOutcome<MeasureEconomicsResult> {
  const d = input.discountRatePercent / 100;
  const e = input.energyEscalationPercent / 100;
  const n = input.lifeYears;
  const investment = input.installedCostUsd - input.incentivesUsd;
  const annual = input.annualEnergySavingsUsd + input.annualWaterSavingsUsd + input.annualOmSavingsUsd;
  const upv = uniformPresentValue(d, n);
  const upvStar = modifiedUniformPresentValue(d, e, n);
  const pvSavings = input.annualEnergySavingsUsd * upvStar + (input.annualWaterSavingsUsd + input.annualOmSavingsUsd) * upv;
  const sir = investment > 0 ? pvSavings / investment : null;
  const value: MeasureEconomicsResult = {
    netInvestmentUsd: investment,
    annualNetSavingsUsd: annual,
    simplePaybackYears: annual > 0 ? investment / annual : null,
    spv: singlePresentValue(d, n),
    upv,
    upvStarEnergy: upvStar,
    pvSavingsUsd: pvSavings,
    netSavingsUsd: pvSavings - investment,
    sir,
    airrPercent: sir !== null && sir > 0 ? ((1 + d) * sir ** (1 / n) - 1) * 100 : null,
    costEffective: pvSavings - investment > 0,
  };
  const notes: string[] = [];
  if (value.simplePaybackYears === null) notes.push('The annual net savings are not positive: the measure does not pay back.');
  else if (value.simplePaybackYears > n) notes.push('Simple payback is longer than the life of the measure.');
  if (sir === null) notes.push('No net investment: SIR and AIRR are not defined.');
  return success(
    value,
    [
      { label: 'Net investment', value: investment, unit: '$' },
      { label: 'Annual net savings', value: annual, unit: '$/yr' },
      ...optionalStep('Simple payback', value.simplePaybackYears, 'yr'),
      { label: `UPV (${input.discountRatePercent} %, ${n} yr)`, value: upv, unit: '' },
      { label: 'UPV* for energy', value: upvStar, unit: '' },
      { label: 'Present value of savings', value: pvSavings, unit: '$' },
      { label: 'Net savings', value: value.netSavingsUsd, unit: '$' },
      ...optionalStep('Savings-to-investment ratio', sir, ''),
      ...optionalStep('Adjusted internal rate of return', value.airrPercent, '%'),
    ],
    notes,
  );
}

export const measureEconomics = {
  schema: measureEconomicsInputSchema,
  formulas: MEASURE_ECONOMICS_FORMULAS,
  sources: MEASURE_ECONOMICS_SOURCES,
  compute: computeMeasureEconomics,
  /** Parses untrusted input (e.g. a finding form) and computes. */
  run: parseThenCompute(measureEconomicsInputSchema, computeMeasureEconomics),
};
