/** Form fields of an import upload, shared by the intake page and the API. */
import { z } from 'zod';
import { installationCodeSchema } from './inventory';

export const importFieldsSchema = z.object({
  installation: installationCodeSchema,
  mapping: z
    .string()
    .max(20_000)
    .optional()
    .transform((s, ctx) => {
      if (s === undefined || s.trim() === '') return undefined;
      try {
        const v: unknown = JSON.parse(s);
        // No NUL (U+0000): PostgreSQL cannot store it in the import record's jsonb.
        const r = z.record(z.string().max(100).regex(/^[^\u0000]*$/), z.string().max(200).regex(/^[^\u0000]*$/)).safeParse(v);
        if (r.success) return r.data;
      } catch {
        /* fall through */
      }
      ctx.addIssue({ code: 'custom', message: 'must be a JSON object of field → column header' });
      return z.NEVER;
    }),
  dryRun: z.enum(['true', 'false'], { message: 'use true or false' }).default('true').transform((v) => v === 'true'),
  progressKey: z.string().regex(/^[A-Za-z0-9_-]{8,64}$/, 'use 8 to 64 letters, digits, - or _').optional(),
});

export const savedMappingSchema = z.object({
  installation: installationCodeSchema,
  name: z.string().trim().min(1, 'required').max(80, 'at most 80 characters'),
  mapping: z.record(z.string().max(100), z.string().max(200)),
});
