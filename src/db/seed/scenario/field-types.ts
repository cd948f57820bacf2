/**
 * The demo scenario's field work as plain data: loaner kits and their instruments, loans with
 * their event history, shortlist flags, walkthroughs with their forms, findings and measures.
 * People are named by e-mail (the loader finds their account ids); walkthroughs, findings,
 * measures, flags and loans carry fixed ids drawn from the seed, so data and tests can refer to them.
 */
import { z } from 'zod';
import { commoditySchema, unitSchema } from '../../../lib/domain';
import { instrumentTypeSchema } from '../../../lib/field/instruments';
import { FINDING_CATEGORIES, MEASURE_STATUSES, WALKTHROUGH_STATUSES, walkthroughFormSchema } from '../../../lib/field/walkthrough-form';

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'expected an ISO date YYYY-MM-DD');
const isoDateTime = z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}Z$/, 'expected an ISO date-time in UTC');
const uuid = z.string().regex(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);

export const INSTRUMENT_CONDITIONS = ['good', 'fair', 'needs-repair', 'retired'] as const;
export const LOAN_STATUSES = ['requested', 'approved', 'shipped', 'in-use', 'returned', 'inspected', 'declined', 'cancelled'] as const;
/** Loans in these states hold their kit for their dates (the database's exclusion constraint). */
export const HOLDING_LOAN_STATUSES = ['requested', 'approved', 'shipped', 'in-use'] as const;

export const demoInstrumentSchema = z.object({
  type: instrumentTypeSchema,
  model: z.string(),
  serial: z.string(),
  /** null for instruments that need no calibration (tape, flashlight, camera, flow bags). */
  calibrationDue: isoDate.nullable(),
  condition: z.enum(INSTRUMENT_CONDITIONS),
  notes: z.string(),
});
export type DemoInstrument = z.infer<typeof demoInstrumentSchema>;

export const demoKitSchema = z.object({
  code: z.string(),
  name: z.string(),
  description: z.string(),
  homeInstallationCode: z.string(),
  homeLocation: z.string(),
  instruments: z.array(demoInstrumentSchema),
});
export type DemoKit = z.infer<typeof demoKitSchema>;

export const demoLoanEventSchema = z.object({
  fromStatus: z.enum(LOAN_STATUSES).nullable(),
  toStatus: z.enum(LOAN_STATUSES),
  by: z.email(),
  note: z.string(),
  at: isoDateTime,
});

export const demoLoanSchema = z.object({
  id: uuid,
  kitCode: z.string(),
  installationCode: z.string(),
  walkthroughId: uuid.nullable(),
  requestedBy: z.email(),
  purpose: z.string(),
  startDate: isoDate,
  endDate: isoDate,
  status: z.enum(LOAN_STATUSES),
  events: z.array(demoLoanEventSchema).min(1),
});
export type DemoLoan = z.infer<typeof demoLoanSchema>;

export const demoFlagSchema = z.object({
  id: uuid,
  installationCode: z.string(),
  buildingNumber: z.string(),
  reason: z.string(),
  flaggedBy: z.email(),
  flaggedAt: isoDateTime,
  clearedBy: z.email().nullable(),
  clearedAt: isoDateTime.nullable(),
});
export type DemoFlag = z.infer<typeof demoFlagSchema>;

export const demoMeasureSchema = z.object({
  id: uuid,
  title: z.string(),
  status: z.enum(MEASURE_STATUSES),
  /** Annual savings per commodity in the unit of the building's meter for it. */
  savings: z.array(z.object({ commodity: commoditySchema, quantity: z.number(), unit: unitSchema })),
  annualEnergyCostSavings: z.number(),
  annualWaterCostSavings: z.number(),
  annualOmCostSavings: z.number(),
  installedCost: z.number().nonnegative(),
  incentives: z.number().nonnegative(),
  lifeYears: z.number().int().positive(),
  /** measureEconomics.run's result with the discount-rate setting used (discountRatePercent, effectiveFrom, source). */
  economics: z.record(z.string(), z.unknown()),
  approvedBy: z.email().nullable(),
  approvedAt: isoDateTime.nullable(),
  implementedOn: isoDate.nullable(),
});
export type DemoMeasure = z.infer<typeof demoMeasureSchema>;

export const demoFindingSchema = z.object({
  id: uuid,
  title: z.string(),
  category: z.enum(FINDING_CATEGORIES),
  location: z.string(),
  description: z.string(),
  status: z.enum(['open', 'dismissed']),
  createdAt: isoDateTime,
  measure: demoMeasureSchema.nullable(),
});
export type DemoFinding = z.infer<typeof demoFindingSchema>;

export const demoWalkthroughSchema = z.object({
  id: uuid,
  installationCode: z.string(),
  buildingNumber: z.string(),
  flagId: uuid.nullable(),
  title: z.string(),
  plannedOn: isoDate,
  auditor: z.email(),
  createdBy: z.email(),
  createdAt: isoDateTime,
  status: z.enum(WALKTHROUGH_STATUSES),
  form: walkthroughFormSchema,
  completedAt: isoDateTime.nullable(),
  findings: z.array(demoFindingSchema),
});
export type DemoWalkthrough = z.infer<typeof demoWalkthroughSchema>;

export const demoFieldSchema = z.object({
  kits: z.array(demoKitSchema),
  loans: z.array(demoLoanSchema),
  flags: z.array(demoFlagSchema),
  walkthroughs: z.array(demoWalkthroughSchema),
});
export type DemoField = z.infer<typeof demoFieldSchema>;
