/** Inputs of the Baselines screen: the analyst's decisions, the baseline period, a refit run and the acceptance thresholds. */
import { z } from 'zod';
import { acceptanceThresholdsSchema } from '../baseline/acceptance';
import { shapeSchema } from '../baseline/grid';
import { installationCodeSchema } from './inventory';

const note = z.string().trim().min(3, 'say why, in a few words').max(2000, 'at most 2,000 characters');
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'use the form YYYY-MM-DD');

export const BASELINE_STATUSES = ['accepted', 'needs-review', 'failing-criteria', 'insufficient-data'] as const;
export const baselineStatusSchema = z.enum(BASELINE_STATUSES);
export type BaselineStatus = z.infer<typeof baselineStatusSchema>;

export const baselineDecisionSchema = z.discriminatedUnion('action', [
  z.object({ meterId: z.uuid(), action: z.literal('accept'), note }),
  z.object({ meterId: z.uuid(), action: z.literal('override'), shape: shapeSchema, note }),
  z.object({ meterId: z.uuid(), action: z.literal('reopen'), note }),
]);
export type BaselineDecision = z.infer<typeof baselineDecisionSchema>;

export const baselinePeriodSchema = z
  .object({ meterId: z.uuid(), start: isoDate, end: isoDate, note })
  .refine((p) => p.start < p.end, { path: ['end'], message: 'must be after the start' })
  .refine((p) => (Date.parse(p.end) - Date.parse(p.start)) / 86_400_000 >= 364, { path: ['end'], message: 'a baseline needs at least 12 months (365 days)' });
export type BaselinePeriod = z.infer<typeof baselinePeriodSchema>;

/** A refit of every baseline, or of one installation's. */
export const baselineRunSchema = z.object({ installation: installationCodeSchema.optional() });

/** The acceptance thresholds as an administrator sets them: CV(RMSE) as a fraction, at most 1. */
export const acceptanceSettingSchema = acceptanceThresholdsSchema.refine((v) => v.maxCvrmse <= 1, { path: ['maxCvrmse'], message: 'at most 1 (100 %)' });
