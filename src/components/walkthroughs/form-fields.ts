/**
 * What each section of the field form asks, as data the form renders: the fields of the plain
 * sections and of each row of the list sections, their units, choices, and a one-line summary of
 * a row for when it is folded. The schema itself is src/lib/field/walkthrough-form.ts.
 */
import { COMMODITY_LABELS } from '../../lib/domain';
import {
  ENVELOPE_COMPONENTS,
  envelopeItemSchema,
  HVAC_EQUIPMENT,
  hvacRowSchema,
  LAMP_TYPE_LABELS,
  LAMP_TYPES,
  lightingRowSchema,
  plugLoadRowSchema,
  WATER_FIXTURES,
  waterRowSchema,
  type SectionId,
} from '../../lib/field/walkthrough-form';
import { formatNumber } from '../../lib/format';
import { humanize, options } from './labels';

export type FieldSpec =
  | { key: string; label: string; kind: 'text' | 'long'; hint?: string }
  | { key: string; label: string; kind: 'number' | 'int'; unit?: string; hint?: string }
  | { key: string; label: string; kind: 'select'; choices: { value: string; label: string }[]; nullable?: boolean; hint?: string }
  | { key: string; label: string; kind: 'check' | 'tri'; hint?: string };

export type Row = Record<string, unknown> & { id: string };

export interface ListSectionSpec {
  kind: 'list';
  listKey: 'rows' | 'items';
  addLabel: string;
  fields: FieldSpec[];
  newRow: (id: string) => Row;
  summary: (r: Row) => string;
}
export interface PlainSectionSpec {
  kind: 'plain';
  fields: FieldSpec[];
}

const CONDITION = options(['good', 'fair', 'poor'] as const);
const FUELS = ['electricity', 'natural_gas', 'fuel_oil_2', 'fuel_oil_6', 'propane', 'district_steam', 'district_chilled_water', 'other'] as const;
const n = (v: unknown, unit = '') => (typeof v === 'number' ? `${formatNumber(v, v % 1 ? 1 : 0)}${unit}` : '');
const join = (...parts: unknown[]) => parts.filter((p) => typeof p === 'string' && p.trim() !== '').join(' · ');

export const SECTION_SPECS: Record<SectionId, ListSectionSpec | PlainSectionSpec> = {
  building: {
    kind: 'plain',
    fields: [
      { key: 'occupiedHoursPerWeek', label: 'Occupied hours per week', kind: 'number', unit: 'h/week' },
      { key: 'typicalOccupants', label: 'Typical occupants', kind: 'int' },
      { key: 'operatingSchedule', label: 'Operating schedule', kind: 'text', hint: 'e.g. Mon–Fri 6:30–18:00, Sat 8–12' },
      { key: 'spaceUses', label: 'Space uses', kind: 'long' },
      { key: 'observedConditions', label: 'Conditions observed', kind: 'long' },
    ],
  },
  envelope: {
    kind: 'list',
    listKey: 'items',
    addLabel: 'Add an envelope item',
    fields: [
      { key: 'component', label: 'Component', kind: 'select', choices: options(ENVELOPE_COMPONENTS) },
      { key: 'location', label: 'Location', kind: 'text' },
      { key: 'condition', label: 'Condition', kind: 'select', choices: CONDITION },
      { key: 'observation', label: 'Observation', kind: 'long' },
    ],
    newRow: (id) => envelopeItemSchema.parse({ id }),
    summary: (r) => join(humanize(String(r.component)), r.location, r.condition),
  },
  lighting: {
    kind: 'list',
    listKey: 'rows',
    addLabel: 'Add a lighting row',
    fields: [
      { key: 'location', label: 'Location', kind: 'text' },
      { key: 'fixture', label: 'Fixture', kind: 'text', hint: 'e.g. 2×4 troffer, 3-lamp' },
      { key: 'lampType', label: 'Lamp type', kind: 'select', choices: options(LAMP_TYPES, LAMP_TYPE_LABELS) },
      { key: 'lampsPerFixture', label: 'Lamps per fixture', kind: 'int' },
      { key: 'ballast', label: 'Ballast or driver', kind: 'text' },
      { key: 'fixtureCount', label: 'Fixtures', kind: 'int' },
      { key: 'wattsPerFixture', label: 'Input watts per fixture', kind: 'number', unit: 'W' },
      { key: 'hoursPerYear', label: 'Hours on per year', kind: 'number', unit: 'h/yr' },
      { key: 'control', label: 'Control', kind: 'select', choices: options(['switch', 'occupancy-sensor', 'timer', 'daylight', 'bas', 'always-on', 'other'] as const, { bas: 'Building automation' }) },
      { key: 'measuredLux', label: 'Measured illuminance', kind: 'number', unit: 'lx' },
    ],
    newRow: (id) => lightingRowSchema.parse({ id }),
    summary: (r) => join(r.location, r.fixture, r.fixtureCount !== null ? `${n(r.fixtureCount)} × ${n(r.wattsPerFixture, ' W') || '? W'}` : '', n(r.hoursPerYear, ' h/yr')),
  },
  hvac: {
    kind: 'list',
    listKey: 'rows',
    addLabel: 'Add equipment',
    fields: [
      { key: 'equipment', label: 'Equipment', kind: 'select', choices: options(HVAC_EQUIPMENT) },
      { key: 'tag', label: 'Tag', kind: 'text', hint: 'as marked on site, e.g. B-1, AHU-3' },
      { key: 'location', label: 'Location', kind: 'text' },
      { key: 'make', label: 'Make', kind: 'text' },
      { key: 'model', label: 'Model', kind: 'text' },
      { key: 'serial', label: 'Serial', kind: 'text' },
      { key: 'capacity', label: 'Nameplate capacity', kind: 'number' },
      { key: 'capacityUnit', label: 'Capacity unit', kind: 'text', hint: 'as printed: kBtu/h, tons, hp, gpm…' },
      { key: 'fuel', label: 'Fuel or source', kind: 'select', choices: options(FUELS, { ...COMMODITY_LABELS, district_chilled_water: 'District chilled water' }) },
      { key: 'yearInstalled', label: 'Year installed', kind: 'int' },
      { key: 'efficiencyNameplate', label: 'Nameplate efficiency', kind: 'text', hint: 'e.g. 80 % AFUE, 11.2 EER' },
      { key: 'condition', label: 'Condition', kind: 'select', choices: CONDITION },
      { key: 'observation', label: 'Observation', kind: 'long' },
    ],
    newRow: (id) => hvacRowSchema.parse({ id }),
    summary: (r) => join(r.tag, humanize(String(r.equipment)), r.make, r.capacity !== null ? `${n(r.capacity)} ${String(r.capacityUnit ?? '')}` : ''),
  },
  plugLoads: {
    kind: 'list',
    listKey: 'rows',
    addLabel: 'Add a load',
    fields: [
      { key: 'item', label: 'Item', kind: 'text' },
      { key: 'location', label: 'Location', kind: 'text' },
      { key: 'count', label: 'Count', kind: 'int' },
      { key: 'wattsEach', label: 'Watts each', kind: 'number', unit: 'W' },
      { key: 'hoursPerYear', label: 'Hours on per year', kind: 'number', unit: 'h/yr' },
      { key: 'measured', label: 'Measured (not from the nameplate)', kind: 'check' },
      { key: 'observation', label: 'Observation', kind: 'long' },
    ],
    newRow: (id) => plugLoadRowSchema.parse({ id }),
    summary: (r) => join(r.item, r.location, r.count !== null ? `${n(r.count)} × ${n(r.wattsEach, ' W') || '? W'}` : ''),
  },
  water: {
    kind: 'list',
    listKey: 'rows',
    addLabel: 'Add a fixture',
    fields: [
      { key: 'fixture', label: 'Fixture', kind: 'select', choices: options(WATER_FIXTURES) },
      { key: 'location', label: 'Location', kind: 'text' },
      { key: 'count', label: 'Count', kind: 'int' },
      { key: 'measuredGallons', label: 'Bag test: volume', kind: 'number', unit: 'gal' },
      { key: 'measuredSeconds', label: 'Bag test: seconds', kind: 'number', unit: 's' },
      { key: 'ratedGpm', label: 'Rated flow', kind: 'number', unit: 'gpm' },
      { key: 'ratedGpf', label: 'Rated flush volume', kind: 'number', unit: 'gpf' },
      { key: 'leaking', label: 'Leaking', kind: 'check' },
      { key: 'observation', label: 'Observation', kind: 'long' },
    ],
    newRow: (id) => waterRowSchema.parse({ id }),
    summary: (r) => join(humanize(String(r.fixture)), r.location, r.count !== null ? `× ${n(r.count)}` : '', r.leaking ? 'leaking' : ''),
  },
  controls: {
    kind: 'plain',
    fields: [
      { key: 'bas', label: 'Building automation', kind: 'select', nullable: true, choices: options(['none', 'partial', 'full'] as const) },
      { key: 'occupiedHeatingSetpointF', label: 'Occupied heating setpoint', kind: 'number', unit: '°F' },
      { key: 'occupiedCoolingSetpointF', label: 'Occupied cooling setpoint', kind: 'number', unit: '°F' },
      { key: 'setbackInUse', label: 'Night and weekend setback in use', kind: 'tri' },
      { key: 'schedulesMatchOccupancy', label: 'Schedules match occupancy', kind: 'tri' },
      { key: 'observation', label: 'Observation', kind: 'long' },
    ],
  },
  notes: { kind: 'plain', fields: [{ key: 'text', label: 'Notes', kind: 'long' }] },
};
