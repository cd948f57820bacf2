/** Inputs of the Baselines screen: the analyst's decisions and the baseline period. */
import { z } from 'zod';
import { shapeSchema } from '../baseline/grid';

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
