/**
 * The walkthrough field form: what an auditor records in a building, section by section, as one
 * JSON document (walkthrough.form). Every section is optional and every list may be empty, so a
 * half-filled form autosaves and reloads as it was; `completed` marks a section done.
 *
 * Shared by the phone form, the API (validation of autosaves), the PDF and BuildingSync reports
 * and the demo scenario. Units are in the field names; numbers are plain numbers.
 */
import { z } from 'zod';

const text = (max = 2000) => z.string().trim().max(max, { error: `At most ${max} characters` }).default('');
const count = z.number().int({ error: 'A whole number' }).min(0, { error: 'Not negative' }).max(1_000_000).nullable().default(null);
const amount = (max = 1e9) => z.number().min(0, { error: 'Not negative' }).max(max).nullable().default(null);
/** A row id from the client (crypto.randomUUID() or any short unique string), so edits merge by row. */
const rowId = z.string().trim().min(1).max(64);

export const SECTION_IDS = ['building', 'envelope', 'lighting', 'hvac', 'plugLoads', 'water', 'controls', 'notes'] as const;
export type SectionId = (typeof SECTION_IDS)[number];

export const SECTION_LABELS: Record<SectionId, string> = {
  building: 'Building and occupancy',
  envelope: 'Envelope',
  lighting: 'Lighting inventory',
  hvac: 'HVAC and nameplates',
  plugLoads: 'Plug and process loads',
  water: 'Water fixtures',
  controls: 'Controls',
  notes: 'Notes',
};

const sectionBase = { completed: z.boolean().default(false) };

export const buildingSectionSchema = z.object({
  ...sectionBase,
  occupiedHoursPerWeek: amount(168),
  typicalOccupants: count,
  operatingSchedule: text(500),
  spaceUses: text(1000),
  observedConditions: text(),
});

export const ENVELOPE_COMPONENTS = ['roof', 'wall', 'window', 'door', 'foundation', 'air-sealing', 'insulation', 'other'] as const;
export const envelopeItemSchema = z.object({
  id: rowId,
  component: z.enum(ENVELOPE_COMPONENTS).default('other'),
  location: text(200),
  condition: z.enum(['good', 'fair', 'poor']).default('fair'),
  observation: text(1000),
});
export const envelopeSectionSchema = z.object({ ...sectionBase, items: z.array(envelopeItemSchema).max(500).default([]) });

export const LAMP_TYPES = ['led', 'linear-fluorescent-t12', 'linear-fluorescent-t8', 'linear-fluorescent-t5', 'compact-fluorescent', 'incandescent', 'halogen', 'metal-halide', 'high-pressure-sodium', 'mercury-vapor', 'induction', 'other'] as const;
export const LAMP_TYPE_LABELS: Record<(typeof LAMP_TYPES)[number], string> = {
  led: 'LED',
  'linear-fluorescent-t12': 'Linear fluorescent T12',
  'linear-fluorescent-t8': 'Linear fluorescent T8',
  'linear-fluorescent-t5': 'Linear fluorescent T5',
  'compact-fluorescent': 'Compact fluorescent',
  incandescent: 'Incandescent',
  halogen: 'Halogen',
  'metal-halide': 'Metal halide',
  'high-pressure-sodium': 'High-pressure sodium',
  'mercury-vapor': 'Mercury vapor',
  induction: 'Induction',
  other: 'Other',
};
export const lightingRowSchema = z.object({
  id: rowId,
  location: text(200),
  fixture: text(200),
  lampType: z.enum(LAMP_TYPES).default('other'),
  lampsPerFixture: count,
  ballast: text(100),
  fixtureCount: count,
  wattsPerFixture: amount(10_000),
  hoursPerYear: amount(8784),
  control: z.enum(['switch', 'occupancy-sensor', 'timer', 'daylight', 'bas', 'always-on', 'other']).default('switch'),
  measuredLux: amount(200_000),
});
export const lightingSectionSchema = z.object({ ...sectionBase, rows: z.array(lightingRowSchema).max(2000).default([]) });

export const HVAC_EQUIPMENT = ['boiler', 'furnace', 'chiller', 'rooftop-unit', 'air-handler', 'heat-pump', 'split-system', 'pump', 'fan', 'cooling-tower', 'water-heater', 'steam-trap', 'other'] as const;
export const hvacRowSchema = z.object({
  id: rowId,
  equipment: z.enum(HVAC_EQUIPMENT).default('other'),
  tag: text(100),
  location: text(200),
  make: text(100),
  model: text(100),
  serial: text(100),
  /** Nameplate capacity and its unit as printed (kBtu/h, tons, hp, gpm...). */
  capacity: amount(),
  capacityUnit: text(20),
  fuel: z.enum(['electricity', 'natural_gas', 'fuel_oil_2', 'fuel_oil_6', 'propane', 'district_steam', 'district_chilled_water', 'other']).default('electricity'),
  yearInstalled: z.number().int().min(1900).max(2100).nullable().default(null),
  efficiencyNameplate: text(50),
  condition: z.enum(['good', 'fair', 'poor']).default('fair'),
  observation: text(1000),
});
export const hvacSectionSchema = z.object({ ...sectionBase, rows: z.array(hvacRowSchema).max(1000).default([]) });

export const plugLoadRowSchema = z.object({
  id: rowId,
  item: text(200),
  location: text(200),
  count: count,
  /** Measured with a plug-in meter or clamp ammeter, or from the nameplate. */
  wattsEach: amount(1_000_000),
  hoursPerYear: amount(8784),
  measured: z.boolean().default(false),
  observation: text(1000),
});
export const plugLoadSectionSchema = z.object({ ...sectionBase, rows: z.array(plugLoadRowSchema).max(2000).default([]) });

export const WATER_FIXTURES = ['lavatory-faucet', 'kitchen-faucet', 'showerhead', 'toilet', 'urinal', 'pre-rinse-spray-valve', 'irrigation', 'cooling-tower', 'other'] as const;
export const waterRowSchema = z.object({
  id: rowId,
  fixture: z.enum(WATER_FIXTURES).default('other'),
  location: text(200),
  count: count,
  /** Flow test: bag volume (gal) and seconds; or rated flow (gpm) / flush volume (gpf). */
  measuredGallons: amount(100),
  measuredSeconds: amount(3600),
  ratedGpm: amount(100),
  ratedGpf: amount(10),
  leaking: z.boolean().default(false),
  observation: text(1000),
});
export const waterSectionSchema = z.object({ ...sectionBase, rows: z.array(waterRowSchema).max(2000).default([]) });

export const controlsSectionSchema = z.object({
  ...sectionBase,
  bas: z.enum(['none', 'partial', 'full']).nullable().default(null),
  occupiedHeatingSetpointF: amount(120),
  occupiedCoolingSetpointF: amount(120),
  setbackInUse: z.boolean().nullable().default(null),
  schedulesMatchOccupancy: z.boolean().nullable().default(null),
  observation: text(),
});

export const notesSectionSchema = z.object({ ...sectionBase, text: text(20_000) });

export const walkthroughFormSchema = z.object({
  building: buildingSectionSchema.default(() => buildingSectionSchema.parse({})),
  envelope: envelopeSectionSchema.default(() => envelopeSectionSchema.parse({})),
  lighting: lightingSectionSchema.default(() => lightingSectionSchema.parse({})),
  hvac: hvacSectionSchema.default(() => hvacSectionSchema.parse({})),
  plugLoads: plugLoadSectionSchema.default(() => plugLoadSectionSchema.parse({})),
  water: waterSectionSchema.default(() => waterSectionSchema.parse({})),
  controls: controlsSectionSchema.default(() => controlsSectionSchema.parse({})),
  notes: notesSectionSchema.default(() => notesSectionSchema.parse({})),
});
export type WalkthroughForm = z.output<typeof walkthroughFormSchema>;

/** An empty form, every section present. */
export function emptyWalkthroughForm(): WalkthroughForm {
  return walkthroughFormSchema.parse({});
}

/** Sections marked done, out of all. */
export function formProgress(form: WalkthroughForm): { completed: number; total: number; sections: Record<SectionId, boolean> } {
  const sections = Object.fromEntries(SECTION_IDS.map((id) => [id, form[id].completed])) as Record<SectionId, boolean>;
  return { completed: Object.values(sections).filter(Boolean).length, total: SECTION_IDS.length, sections };
}

export const WALKTHROUGH_STATUSES = ['planned', 'in-progress', 'completed', 'cancelled'] as const;
export type WalkthroughStatus = (typeof WALKTHROUGH_STATUSES)[number];

export const PHOTO_TAGS = ['building-number', 'nameplate', 'lighting', 'load', 'envelope', 'water', 'controls', 'other'] as const;
export type PhotoTag = (typeof PHOTO_TAGS)[number];
export const PHOTO_TAG_LABELS: Record<PhotoTag, string> = {
  'building-number': 'Building number',
  nameplate: 'Nameplate',
  lighting: 'Lighting',
  load: 'Plug or process load',
  envelope: 'Envelope',
  water: 'Water fixture',
  controls: 'Controls',
  other: 'Other',
};
/** Accepted photo types and size: what phone cameras produce, kept under a size a field upload can carry. */
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic'] as const;
export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;

/** Finding categories; BuildingSync measure categories are mapped from these in the report. */
export const FINDING_CATEGORIES = ['lighting', 'hvac', 'envelope', 'plug-loads', 'water', 'controls', 'domestic-hot-water', 'motors', 'operations', 'other'] as const;
export type FindingCategory = (typeof FINDING_CATEGORIES)[number];
export const FINDING_CATEGORY_LABELS: Record<FindingCategory, string> = {
  lighting: 'Lighting',
  hvac: 'Heating, ventilation and air conditioning',
  envelope: 'Building envelope',
  'plug-loads': 'Plug and process loads',
  water: 'Water use',
  controls: 'Controls and schedules',
  'domestic-hot-water': 'Domestic hot water',
  motors: 'Motors and drives',
  operations: 'Operations and maintenance',
  other: 'Other',
};

export const MEASURE_STATUSES = ['proposed', 'approved', 'implemented', 'rejected'] as const;
export type MeasureStatus = (typeof MEASURE_STATUSES)[number];
