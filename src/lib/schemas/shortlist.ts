/** Inputs of the Shortlist: filters, weights and flags, shared by the screen and the API. */
import { z } from 'zod';
import { commoditySchema, useTypeSchema } from '../domain';
import { installationCodeSchema } from './inventory';

export const shortlistQuerySchema = z.object({
  installation: installationCodeSchema.optional(),
  useType: useTypeSchema.optional(),
  commodity: commoditySchema.optional(),
  minAreaFt2: z.coerce.number().min(0).optional(),
  maxAreaFt2: z.coerce.number().min(0).optional(),
  limit: z.coerce.number().int().min(0).max(20_000).default(100),
  offset: z.coerce.number().int().min(0).default(0),
  /** Breakdowns (terms and sentences) for this many of the rows returned. */
  explain: z.coerce.number().int().min(0).max(20_000).default(25),
  format: z.enum(['json', 'csv', 'xlsx']).default('json'),
});

export const flagInputSchema = z.object({
  buildingId: z.uuid('must be a building id'),
  reason: z.string().trim().min(5, 'say why, in a few words (at least 5 characters)').max(1000, 'at most 1,000 characters'),
});
