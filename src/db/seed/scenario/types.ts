/**
 * The shape of the demo scenario: plain data a loader inserts as it is, plus the `truth` the
 * tests (and the analyst) can compare fitted baselines against. zod schemas sit next to the types
 * so a loader can check what it receives.
 */
import { z } from 'zod';
import { commoditySchema, roleSchema, unitSchema, useTypeSchema } from '../../../lib/domain';
import { demoFieldSchema } from './field-types';

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'expected an ISO date YYYY-MM-DD');

export const scenarioOptionsSchema = z
  .object({
    seed: z.number().int().min(0).max(0xffffffff).default(2026),
    today: isoDate.default('2026-11-30'),
    years: z.number().int().min(3).max(10).default(4),
    weatherYears: z.number().int().min(10).max(40).default(12),
  })
  .refine((o) => o.weatherYears > o.years, {
    message: 'weatherYears must exceed years so that weather covers every bill',
    path: ['weatherYears'],
  });
export type ScenarioOptions = z.input<typeof scenarioOptionsSchema>;
export type ResolvedOptions = z.output<typeof scenarioOptionsSchema>;

export const weatherDaySchema = z.object({
  date: isoDate,
  tmaxF: z.number().nullable(),
  tminF: z.number().nullable(),
});
export type WeatherDay = z.infer<typeof weatherDaySchema>;

export const stationSchema = z.object({
  code: z.string(),
  name: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  elevationFt: z.number(),
  climate: z.string(),
  days: z.array(weatherDaySchema),
});

export const installationSchema = z.object({
  code: z.string(),
  name: z.string(),
  regionCode: z.string(),
  climate: z.string(),
  stationCode: z.string(),
  timeZone: z.string(),
  target: z.object({ baselineFy: z.number().int(), reductionPct: z.number(), targetFy: z.number().int() }),
});

export const buildingSchema = z.object({
  installationCode: z.string(),
  number: z.string(),
  name: z.string(),
  useType: useTypeSchema,
  grossAreaFt2: z.number().positive(),
  yearBuilt: z.number().int(),
  occupants: z.number().int().nonnegative(),
  lastEvaluatedOn: isoDate.nullable(),
});
export type DemoBuilding = z.infer<typeof buildingSchema>;

export const meterSchema = z.object({
  installationCode: z.string(),
  buildingNumber: z.string(),
  code: z.string(),
  commodity: commoditySchema,
  unit: unitSchema,
  account: z.string(),
  heatContentKbtuPerUnit: z.number().positive().optional(),
});
export type DemoMeter = z.infer<typeof meterSchema>;

export const billSchema = z.object({
  meterCode: z.string(),
  periodStart: isoDate,
  periodEnd: isoDate,
  quantity: z.number().nonnegative(),
  unit: unitSchema,
  cost: z.number().nonnegative(),
  demandKw: z.number().nonnegative().nullable(),
  estimated: z.boolean(),
});
export type DemoBill = z.infer<typeof billSchema>;

export const personSchema = z.object({
  email: z.email(),
  name: z.string(),
  role: roleSchema,
  installationCodes: z.array(z.string()),
});
export type DemoPerson = z.infer<typeof personSchema>;

/**
 * Physical parameters of one meter, in the meter's own unit: use per day =
 * basePerDay + heatingSlope·HDD(heatingBalanceF) + coolingSlope·CDD(coolingBalanceF), times
 * (1 + noise) with noise ~ N(0, noiseCv). A slope of 0 comes with a null balance point.
 */
export const meterTruthSchema = z.object({
  basePerDay: z.number().nonnegative(),
  heatingSlope: z.number().nonnegative(),
  heatingBalanceF: z.number().nullable(),
  coolingSlope: z.number().nonnegative(),
  coolingBalanceF: z.number().nullable(),
  noiseCv: z.number().positive(),
  unit: unitSchema,
});
export type MeterTruth = z.infer<typeof meterTruthSchema>;

export const POOR_PERFORMER_KINDS = [
  'base-load',
  'heating',
  'water-leak',
  'year-over-year',
  'never-evaluated',
] as const;

export const poorPerformerSchema = z.object({
  buildingNumber: z.string(),
  installationCode: z.string(),
  kind: z.enum(POOR_PERFORMER_KINDS),
  /** The meter that carries the fault. */
  meterCode: z.string(),
  reason: z.string(),
  /** Intended site EUI as a multiple of the building type's CBECS 2018 median. */
  intendedEuiMultiple: z.number(),
  /** For a change partway through: the date it starts and the parameters from then on. */
  changedOn: isoDate.optional(),
  after: meterTruthSchema.optional(),
});
export type PoorPerformer = z.infer<typeof poorPerformerSchema>;

export const retrofitSchema = z.object({
  meterCode: z.string(),
  buildingNumber: z.string(),
  installationCode: z.string(),
  measure: z.string(),
  date: isoDate,
  /** Stated drop of the changed parameter, percent. */
  reductionPct: z.number(),
  before: meterTruthSchema,
  after: meterTruthSchema,
});
export type Retrofit = z.infer<typeof retrofitSchema>;

export const messyItemSchema = z.object({
  kind: z.string(),
  meterCode: z.string(),
  detail: z.string(),
  /** Start of the first bill concerned (missing, estimated, duplicated or zero). */
  periodStart: isoDate,
});
export type MessyItem = z.infer<typeof messyItemSchema>;

export const demoScenarioSchema = z.object({
  region: z.object({ code: z.string(), name: z.string() }),
  stations: z.array(stationSchema),
  installations: z.array(installationSchema),
  buildings: z.array(buildingSchema),
  meters: z.array(meterSchema),
  bills: z.array(billSchema),
  people: z.array(personSchema),
  truth: z.object({
    meters: z.record(z.string(), meterTruthSchema),
    retrofit: retrofitSchema,
    poorPerformers: z.array(poorPerformerSchema),
    messy: z.array(messyItemSchema),
  }),
  /** Kits, loans, flags and walkthroughs (field-types.ts), loaded after the accounts. */
  field: demoFieldSchema,
});
export type DemoScenario = z.infer<typeof demoScenarioSchema>;
