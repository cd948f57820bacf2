/**
 * Weights of the audit-priority terms (methods §5), editable by the regional manager and saved.
 *
 * Weights are non-negative numbers of any scale; the score divides each by their sum, so
 * {30, 20, …} and {0.3, 0.2, …} rank alike. At least one weight must be positive.
 *
 * Defaults (a project decision; 100 points in all):
 * - excessEnergy 30 and excessCost 20: half the score is the savings an audit could find;
 * - evaluationAge 15: keeps every building inside the four-year evaluation cycle (EISA 2007 §432);
 * - yoyIncrease 15: a rise in weather-normalized use is often a fault worth a visit;
 * - anomalies 10: recent bills far off the baseline (can also be a meter or billing error);
 * - manualFlag 10: the manager's own knowledge moves a building up without overriding the data.
 */
import { z } from 'zod';

export const PRIORITY_TERMS = [
  'excessEnergy',
  'excessCost',
  'yoyIncrease',
  'anomalies',
  'evaluationAge',
  'manualFlag',
] as const;
export type PriorityTerm = (typeof PRIORITY_TERMS)[number];

export const PRIORITY_TERM_LABELS: Readonly<Record<PriorityTerm, string>> = {
  excessEnergy: 'Excess energy over the peer median',
  excessCost: 'Cost of that excess',
  yoyIncrease: 'Rise in normalized use over last year',
  anomalies: 'Recent bills off the baseline',
  evaluationAge: 'Time since the last evaluation',
  manualFlag: 'Flagged by a manager',
};

const weight = z.number().min(0).max(1000);

export const priorityWeightsSchema = z
  .object({
    excessEnergy: weight,
    excessCost: weight,
    yoyIncrease: weight,
    anomalies: weight,
    evaluationAge: weight,
    manualFlag: weight,
  })
  .refine((w) => PRIORITY_TERMS.some((t) => w[t] > 0), {
    message: 'at least one weight must be above zero',
  });
export type PriorityWeights = z.infer<typeof priorityWeightsSchema>;

export const DEFAULT_PRIORITY_WEIGHTS: PriorityWeights = {
  excessEnergy: 30,
  excessCost: 20,
  yoyIncrease: 15,
  anomalies: 10,
  evaluationAge: 15,
  manualFlag: 10,
};

/**
 * Weights divided by their sum (each 0–1, summing to 1), in PRIORITY_TERMS order.
 * @throws Error when no weight is positive (the schema rejects such input first).
 * @example normalizeWeights(DEFAULT_PRIORITY_WEIGHTS)[0] // 0.3
 */
export function normalizeWeights(w: PriorityWeights): Float64Array {
  const out = new Float64Array(PRIORITY_TERMS.length);
  let total = 0;
  PRIORITY_TERMS.forEach((t, i) => {
    const v = Math.max(0, w[t]);
    out[i] = v;
    total += v;
  });
  if (!(total > 0)) throw new Error('priority weights sum to zero');
  for (let i = 0; i < out.length; i++) out[i] = out[i]! / total;
  return out;
}
