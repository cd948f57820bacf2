/** Inputs of the weather screens and API, shared by the forms and the server. */
import { z } from 'zod';
import { installationCodeSchema } from './inventory';

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'use the form YYYY-MM-DD');

export const stationCodeSchema = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]{1,31}$/, 'use 2 to 32 letters, digits, dots, dashes or underscores');

export const stationInputSchema = z.object({
  code: stationCodeSchema,
  name: z.string().trim().min(2, 'at least 2 characters').max(120, 'at most 120 characters'),
  latitude: z.coerce.number().min(-90, 'between -90 and 90').max(90, 'between -90 and 90').nullable().default(null),
  longitude: z.coerce.number().min(-180, 'between -180 and 180').max(180, 'between -180 and 180').nullable().default(null),
  elevationFt: z.coerce.number().min(-1500).max(30_000).nullable().default(null),
  /** GHCN-Daily station id at the weather service, e.g. USW00014739. */
  serviceId: z
    .string()
    .trim()
    .regex(/^[A-Z]{2}[A-Z0-9]{9}$/, 'a GHCN-Daily id: 2 letters and 9 letters or digits, e.g. USW00014739')
    .nullable()
    .default(null),
  installation: installationCodeSchema,
});
export type StationInput = z.infer<typeof stationInputSchema>;

export const fetchRangeSchema = z
  .object({ start: isoDate, end: isoDate })
  .refine((r) => r.start <= r.end, { path: ['end'], message: 'must not be before the start' })
  .refine((r) => (Date.parse(r.end) - Date.parse(r.start)) / 86_400_000 <= 366 * 20, { path: ['end'], message: 'at most 20 years at a time' });

export const degreeDayQuerySchema = z
  .object({
    station: stationCodeSchema,
    start: isoDate,
    end: isoDate,
    base: z.coerce.number().min(-50, 'between -50 and 120').max(120, 'between -50 and 120').default(65),
    unit: z.enum(['F', 'C']).default('F'),
  })
  .refine((r) => r.start <= r.end, { path: ['end'], message: 'must not be before the start' });

export const weatherUploadSchema = z.object({
  units: z.enum(['standard', 'metric', 'F', 'C', 'tenths-C'], { message: 'say whether temperatures are in °F (standard) or °C (metric)' }),
});
