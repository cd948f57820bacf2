/**
 * Bodies of the walkthrough API, shared by the islands and the routes: planning, edits of the
 * plan, autosaves of the form (by section, with the form version for optimistic concurrency),
 * status changes, findings and photo details.
 */
import { z } from 'zod';
import {
  buildingSectionSchema,
  controlsSectionSchema,
  envelopeSectionSchema,
  FINDING_CATEGORIES,
  hvacSectionSchema,
  lightingSectionSchema,
  notesSectionSchema,
  PHOTO_TAGS,
  plugLoadSectionSchema,
  WALKTHROUGH_STATUSES,
  waterSectionSchema,
} from './walkthrough-form';

const isoDate = z.iso.date({ error: 'A date (YYYY-MM-DD)' }).refine((d) => d >= '2000-01-01' && d <= '2100-12-31', { error: 'A date between 2000 and 2100' });
const title = z.string().trim().min(3, { error: 'At least 3 characters' }).max(200, { error: 'At most 200 characters' });

export const walkthroughPlanSchema = z.object({
  buildingId: z.uuid({ error: 'Choose a building' }),
  title,
  plannedOn: isoDate,
  /** A field auditor assigned to the building's installation; null = not assigned yet. */
  auditorId: z.string().trim().min(1).max(100).nullable().default(null),
  /** The open flag this walkthrough answers; by default the building's open flag, if any. */
  flagId: z.uuid().nullable().optional(),
});
export type WalkthroughPlan = z.output<typeof walkthroughPlanSchema>;

export const walkthroughPlanPatchSchema = z
  .object({ title, plannedOn: isoDate, auditorId: z.string().trim().min(1).max(100).nullable() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { error: 'Nothing to change' });

/** The sections that changed, each replacing the stored one; sections left out stay as stored. */
export const formSectionsSchema = z.object({
  building: buildingSectionSchema.optional(),
  envelope: envelopeSectionSchema.optional(),
  lighting: lightingSectionSchema.optional(),
  hvac: hvacSectionSchema.optional(),
  plugLoads: plugLoadSectionSchema.optional(),
  water: waterSectionSchema.optional(),
  controls: controlsSectionSchema.optional(),
  notes: notesSectionSchema.optional(),
});

/** An autosave: the version the edits were made on, and the changed sections. */
export const formSaveSchema = z.object({
  formVersion: z.number().int().min(0),
  form: formSectionsSchema,
});
export type FormSave = z.input<typeof formSaveSchema>;

export const walkthroughStatusChangeSchema = z.object({
  status: z.enum(WALKTHROUGH_STATUSES),
  /** Completing with sections still open needs this, after the auditor has seen the list. */
  acknowledgeIncomplete: z.boolean().default(false),
  note: z.string().trim().max(1000).default(''),
});

export const findingInputSchema = z.object({
  title,
  category: z.enum(FINDING_CATEGORIES, { error: 'Choose a category' }),
  location: z.string().trim().max(200).default(''),
  description: z.string().trim().max(10_000, { error: 'At most 10,000 characters' }).default(''),
});
export type FindingInput = z.output<typeof findingInputSchema>;

export const findingPatchSchema = z
  .object({
    title,
    category: z.enum(FINDING_CATEGORIES),
    location: z.string().trim().max(200),
    description: z.string().trim().max(10_000, { error: 'At most 10,000 characters' }),
    status: z.enum(['open', 'dismissed']),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { error: 'Nothing to change' });
export type FindingPatch = z.output<typeof findingPatchSchema>;

export const photoFieldsSchema = z.object({
  tag: z.enum(PHOTO_TAGS, { error: `Tag: one of ${PHOTO_TAGS.join(', ')}` }),
  caption: z.string().trim().max(500).default(''),
  findingId: z.uuid().nullable().default(null),
});

export const photoPatchSchema = z
  .object({ tag: z.enum(PHOTO_TAGS), caption: z.string().trim().max(500), findingId: z.uuid().nullable() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { error: 'Nothing to change' });
