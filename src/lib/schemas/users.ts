/** Input schemas for account administration, shared by the admin forms and the API. */
import { z } from 'zod';
import { roleSchema } from '../domain';
import { installationCodeSchema } from './inventory';

export const userInputSchema = z.object({
  email: z.email('not an e-mail address').trim().toLowerCase().max(254),
  name: z.string().trim().min(2, 'at least 2 characters').max(120, 'at most 120 characters'),
  role: roleSchema,
  installations: z.array(installationCodeSchema).max(500).default([]),
});
export type UserInput = z.infer<typeof userInputSchema>;

export const userPatchSchema = z
  .object({
    name: userInputSchema.shape.name,
    role: roleSchema,
    installations: z.array(installationCodeSchema).max(500),
    banned: z.boolean(),
  })
  .partial();
export type UserPatch = z.infer<typeof userPatchSchema>;
