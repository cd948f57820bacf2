/**
 * Input schemas for the inventory (installations, buildings, meters), shared by the forms in the
 * browser and the API on the server so both give the same messages.
 */
import { z } from 'zod';
import { COMMODITY_UNITS, commoditySchema, unitSchema, useTypeSchema } from '../domain';

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'use the form YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'not a real date');

const text = (max: number) => z.string().trim().max(max, `at most ${max} characters`);

function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

export const installationCodeSchema = z
  .string()
  .trim()
  .regex(/^[A-Z0-9][A-Z0-9-]{1,11}$/, 'use 2 to 12 capital letters, digits or dashes');

export const installationInputSchema = z.object({
  code: installationCodeSchema,
  name: text(120).min(2, 'at least 2 characters'),
  climate: text(120).default(''),
  timeZone: z.string().trim().refine(isTimeZone, 'not a known time zone (e.g. America/Chicago)'),
  address: text(300).default(''),
});
export type InstallationInput = z.infer<typeof installationInputSchema>;

export const installationPatchSchema = installationInputSchema.omit({ code: true }).partial();
export type InstallationPatch = z.infer<typeof installationPatchSchema>;

/** An installation's energy-intensity target: a reduction from a baseline fiscal year by a target year. */
export const installationTargetSchema = z.object({
  baselineFy: z.number().int().min(1990, 'from FY1990').max(2100),
  reductionPct: z.number().gt(0, 'must be above 0 %').max(100, 'at most 100 %'),
  targetFy: z.number().int().min(1991).max(2100),
});
export type InstallationTarget = z.infer<typeof installationTargetSchema>;

const thisYear = new Date().getUTCFullYear();

const buildingFields = {
  number: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9.\-/]{0,19}$/, 'use up to 20 letters, digits, dots, dashes or slashes'),
  name: text(120).min(1, 'required'),
  useType: useTypeSchema,
  grossAreaFt2: z.coerce
    .number({ message: 'must be a number' })
    .positive('must be greater than 0')
    .max(50_000_000, 'must be at most 50,000,000 ft²'),
  yearBuilt: z.coerce
    .number({ message: 'must be a number' })
    .int('must be a whole year')
    .min(1800, 'must be 1800 or later')
    .max(thisYear + 1, `must be ${thisYear + 1} or earlier`)
    .nullable()
    .default(null),
  occupants: z.coerce
    .number({ message: 'must be a number' })
    .int('must be a whole number')
    .min(0, 'cannot be negative')
    .max(100_000, 'must be at most 100,000')
    .nullable()
    .default(null),
  lastEvaluatedOn: isoDate.nullable().default(null),
  notes: text(2000).default(''),
};

export const buildingInputSchema = z.object({ installation: installationCodeSchema, ...buildingFields });
export type BuildingInput = z.infer<typeof buildingInputSchema>;

export const buildingPatchSchema = z.object(buildingFields).partial().extend({ archived: z.boolean().optional() });
export type BuildingPatch = z.infer<typeof buildingPatchSchema>;

export const meterCodeSchema = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9._\-/]{0,39}$/, 'use up to 40 letters, digits, dots, dashes or slashes');

export const meterInputSchema = z
  .object({
    buildingId: z.uuid('must be a building id'),
    code: meterCodeSchema,
    commodity: commoditySchema,
    unit: unitSchema,
    account: text(60).default(''),
    heatContentKbtuPerUnit: z.coerce.number().positive('must be greater than 0').max(10_000).nullable().default(null),
  })
  .refine((m) => COMMODITY_UNITS[m.commodity].includes(m.unit), {
    path: ['unit'],
    message: 'is not a unit this commodity is billed in',
  })
  .refine((m) => m.commodity !== 'district_steam' || m.heatContentKbtuPerUnit !== null, {
    path: ['heatContentKbtuPerUnit'],
    message: 'district steam needs the heat content the supplier states (kBtu per billing unit)',
  });
export type MeterInput = z.infer<typeof meterInputSchema>;

export const meterPatchSchema = z
  .object({
    code: meterCodeSchema,
    account: text(60),
    unit: unitSchema,
    heatContentKbtuPerUnit: z.coerce.number().positive().max(10_000).nullable(),
    active: z.boolean(),
  })
  .partial();
export type MeterPatch = z.infer<typeof meterPatchSchema>;
