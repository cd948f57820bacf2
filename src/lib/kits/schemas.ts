/**
 * Input schemas of the kit library (kits, instruments, loans), shared by the forms in the browser
 * and the API on the server so both give the same messages.
 */
import { z } from 'zod';
import { instrumentTypeSchema } from '../field/instruments';
import { dayFromIso } from '../weather/day-number';
import { installationCodeSchema } from '../schemas/inventory';
import { instrumentConditionSchema } from './kit-readiness';
import { LOAN_STATUSES, loanStatusSchema } from './loan-states';

export const isoDateSchema = z
  .string({ message: 'a date is required' })
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'use the form YYYY-MM-DD')
  .refine((s) => dayFromIso(s) !== null, 'not a real date');

const text = (max: number) => z.string().trim().max(max, `at most ${max} characters`);
const atLeastOne = (o: object) => Object.values(o).some((v) => v !== undefined);

export const kitCodeSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9-]{1,19}$/, 'use 2 to 20 letters, digits or dashes');

export const kitInputSchema = z.object({
  code: kitCodeSchema,
  name: text(120).min(2, 'at least 2 characters'),
  description: text(1000).default(''),
  homeLocation: text(200).default(''),
});
export type KitInput = z.infer<typeof kitInputSchema>;

export const kitPatchSchema = z
  .object({
    code: kitCodeSchema.optional(),
    name: text(120).min(2, 'at least 2 characters').optional(),
    description: text(1000).optional(),
    homeLocation: text(200).optional(),
    active: z.boolean().optional(),
  })
  .refine(atLeastOne, 'nothing to change');
export type KitPatch = z.infer<typeof kitPatchSchema>;

const instrumentFields = {
  kitId: z.uuid('not a kit id').nullable(),
  type: instrumentTypeSchema,
  model: text(120),
  serial: text(60).min(1, 'required'),
  calibrationDue: isoDateSchema.nullable(),
  condition: instrumentConditionSchema,
  notes: text(2000),
};

export const instrumentInputSchema = z.object({
  ...instrumentFields,
  kitId: instrumentFields.kitId.default(null),
  model: instrumentFields.model.default(''),
  calibrationDue: instrumentFields.calibrationDue.default(null),
  condition: instrumentFields.condition.default('good'),
  notes: instrumentFields.notes.default(''),
});
export type InstrumentInput = z.infer<typeof instrumentInputSchema>;

export const instrumentPatchSchema = z.object(instrumentFields).partial().refine(atLeastOne, 'nothing to change');
export type InstrumentPatch = z.infer<typeof instrumentPatchSchema>;

/** `POST /api/loans`: the contract for the planner and for scripts. */
export const loanRequestSchema = z.object({
  kitId: z.uuid('not a kit id'),
  start: isoDateSchema,
  end: isoDateSchema,
  purpose: text(500).min(3, 'say in a few words what the kit is for'),
  walkthroughId: z.uuid('not a walkthrough id').nullish(),
  /** The installation the loan is for, when neither the walkthrough nor the requester's single installation says it. */
  installation: installationCodeSchema.nullish(),
});
export type LoanRequest = z.infer<typeof loanRequestSchema>;

export const loanTransitionSchema = z.object({
  to: loanStatusSchema,
  note: text(1000).default(''),
  /** At inspection: instruments found in another condition (e.g. one needs repair). */
  conditions: z
    .array(z.object({ instrumentId: z.uuid('not an instrument id'), condition: instrumentConditionSchema }))
    .max(100)
    .default([]),
});
export type LoanTransition = z.infer<typeof loanTransitionSchema>;

const dateWindow = {
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
};
const windowOrdered = (q: { from?: string | undefined; to?: string | undefined }) => !q.from || !q.to || q.from <= q.to;

export const kitsQuerySchema = z
  .object(dateWindow)
  .refine((q) => !!q.from === !!q.to, { message: 'give both from and to, or neither', path: ['to'] })
  .refine(windowOrdered, { message: 'to is before from', path: ['to'] });

export const kitQuerySchema = z.object(dateWindow).refine(windowOrdered, { message: 'to is before from', path: ['to'] });

export const loansQuerySchema = z
  .object({
    ...dateWindow,
    status: z
      .string()
      .trim()
      .transform((s) => s.split(',').map((x) => x.trim()).filter(Boolean))
      .pipe(z.array(z.enum(LOAN_STATUSES, { message: `use ${LOAN_STATUSES.join(', ')}` })))
      .optional(),
    kit: z.uuid('not a kit id').optional(),
    mine: z.enum(['0', '1']).optional(),
    limit: z.coerce.number().int().min(1).max(1000).default(200),
  })
  .refine(windowOrdered, { message: 'to is before from', path: ['to'] });
export type LoansQuery = z.infer<typeof loansQuerySchema>;

export const instrumentsQuerySchema = z.object({
  kit: z.union([z.uuid('not a kit id'), z.literal('none')]).optional(),
  type: instrumentTypeSchema.optional(),
  calibration: z.enum(['due-soon', 'past-due', 'attention']).optional(),
  retired: z.enum(['include', 'exclude']).default('exclude'),
});
export type InstrumentsQuery = z.infer<typeof instrumentsQuerySchema>;
