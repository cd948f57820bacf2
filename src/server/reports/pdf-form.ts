/**
 * The field form's sections as readable tables in the printable report: building and occupancy,
 * envelope, lighting inventory, HVAC nameplates, plug and process loads, water fixtures (with the
 * flow-test result in gpm), controls and notes. Empty sections say so in one line.
 */
import { formatNumber } from '../../lib/format';
import { bagFillFlowGpm } from '../../lib/field/fixture-flow-test';
import { LAMP_TYPE_LABELS, SECTION_LABELS, type SectionId, type WalkthroughForm } from '../../lib/field/walkthrough-form';
import { heading, keyValues, MUTED, paragraph, table, widths, type Doc, type Fonts } from './pdf-layout';

const n = (v: number | null, digits = 0) => (v === null ? '' : formatNumber(v, digits));
const yesNo = (v: boolean | null) => (v === null ? '' : v ? 'yes' : 'no');
const words = (code: string) => code.replace(/[-_]/g, ' ');

function sectionTitle(doc: Doc, fonts: Fonts, id: SectionId, form: WalkthroughForm): void {
  heading(doc, fonts, `${SECTION_LABELS[id]}${form[id].completed ? '' : ' (not marked complete)'}`, 2);
}

function none(doc: Doc, fonts: Fonts, what: string): void {
  paragraph(doc, fonts, `No ${what} recorded.`, { color: MUTED, size: 9 });
}

/** Every section of the form, in the form's order. */
export function formSections(doc: Doc, fonts: Fonts, form: WalkthroughForm): void {
  heading(doc, fonts, 'Field form');
  const b = form.building;
  sectionTitle(doc, fonts, 'building', form);
  keyValues(doc, fonts, [
    ['Occupied hours per week', n(b.occupiedHoursPerWeek)],
    ['Typical occupants', n(b.typicalOccupants)],
    ['Operating schedule', b.operatingSchedule],
    ['Space uses', b.spaceUses],
    ['Observed conditions', b.observedConditions],
  ]);

  sectionTitle(doc, fonts, 'envelope', form);
  if (form.envelope.items.length === 0) none(doc, fonts, 'envelope items');
  else table(doc, fonts, zip(['Component', 'Location', 'Condition', 'Observation'], widths(doc, [1.2, 1.6, 0.8, 4])), form.envelope.items.map((e) => [words(e.component), e.location, e.condition, e.observation]));

  sectionTitle(doc, fonts, 'lighting', form);
  if (form.lighting.rows.length === 0) none(doc, fonts, 'lighting');
  else {
    const cols = zip(['Location', 'Fixture', 'Lamp', 'Lamps/fixture', 'Ballast', 'Fixtures', 'W/fixture', 'Hours/yr', 'Control', 'Measured lux'], widths(doc, [1.6, 1.2, 1.3, 0.8, 1, 0.8, 0.8, 0.8, 1.1, 0.9]), [3, 5, 6, 7, 9]);
    table(doc, fonts, cols, form.lighting.rows.map((l) => [l.location, l.fixture, LAMP_TYPE_LABELS[l.lampType], n(l.lampsPerFixture), l.ballast, n(l.fixtureCount), n(l.wattsPerFixture, 1), n(l.hoursPerYear), words(l.control), n(l.measuredLux)]));
  }

  sectionTitle(doc, fonts, 'hvac', form);
  if (form.hvac.rows.length === 0) none(doc, fonts, 'HVAC equipment');
  else {
    const cols = zip(['Equipment', 'Tag / location', 'Make, model, serial', 'Capacity', 'Fuel', 'Year', 'Efficiency', 'Condition', 'Observation'], widths(doc, [1, 1.3, 1.6, 0.9, 0.9, 0.5, 0.9, 0.85, 1.65]), [3, 5]);
    table(doc, fonts, cols, form.hvac.rows.map((h) => [words(h.equipment), [h.tag, h.location].filter(Boolean).join(', '), [h.make, h.model, h.serial].filter(Boolean).join(' / '), h.capacity === null ? '' : `${n(h.capacity, 1)} ${h.capacityUnit}`, words(h.fuel), h.yearInstalled === null ? '' : String(h.yearInstalled), h.efficiencyNameplate, h.condition, h.observation]));
  }

  sectionTitle(doc, fonts, 'plugLoads', form);
  if (form.plugLoads.rows.length === 0) none(doc, fonts, 'plug or process loads');
  else {
    const cols = zip(['Item', 'Location', 'Count', 'W each', 'Hours/yr', 'Measured', 'Observation'], widths(doc, [1.6, 1.4, 0.6, 0.8, 0.8, 0.8, 2.6]), [2, 3, 4]);
    table(doc, fonts, cols, form.plugLoads.rows.map((p) => [p.item, p.location, n(p.count), n(p.wattsEach, 1), n(p.hoursPerYear), p.measured ? 'measured' : 'nameplate', p.observation]));
  }

  sectionTitle(doc, fonts, 'water', form);
  if (form.water.rows.length === 0) none(doc, fonts, 'water fixtures');
  else {
    const cols = zip(['Fixture', 'Location', 'Count', 'Flow test', 'Measured gpm', 'Rated gpm / gpf', 'Leaking', 'Observation'], widths(doc, [1.1, 1.2, 0.65, 1, 0.8, 0.9, 0.75, 2.1]), [2, 4]);
    table(
      doc,
      fonts,
      cols,
      form.water.rows.map((w) => {
        const tested = w.measuredGallons !== null && w.measuredSeconds !== null && w.measuredSeconds > 0;
        const rated = [w.ratedGpm === null ? '' : `${n(w.ratedGpm, 2)} gpm`, w.ratedGpf === null ? '' : `${n(w.ratedGpf, 2)} gpf`].filter(Boolean).join(', ');
        return [words(w.fixture), w.location, n(w.count), tested ? `${n(w.measuredGallons, 2)} gal in ${n(w.measuredSeconds, 1)} s` : '', tested ? n(bagFillFlowGpm(w.measuredGallons!, w.measuredSeconds!), 2) : '', rated, w.leaking ? 'yes' : '', w.observation];
      }),
    );
  }

  const c = form.controls;
  sectionTitle(doc, fonts, 'controls', form);
  keyValues(doc, fonts, [
    ['Building automation', c.bas ?? ''],
    ['Setback in use', yesNo(c.setbackInUse)],
    ['Occupied heating setpoint', c.occupiedHeatingSetpointF === null ? '' : `${n(c.occupiedHeatingSetpointF)} °F`],
    ['Occupied cooling setpoint', c.occupiedCoolingSetpointF === null ? '' : `${n(c.occupiedCoolingSetpointF)} °F`],
    ['Schedules match occupancy', yesNo(c.schedulesMatchOccupancy)],
    ['Observation', c.observation],
  ]);

  sectionTitle(doc, fonts, 'notes', form);
  if (form.notes.text) paragraph(doc, fonts, form.notes.text);
  else none(doc, fonts, 'notes');
}

/** Columns from headers and widths; the listed indexes are right-aligned (numbers). */
function zip(headers: readonly string[], ws: readonly number[], right: readonly number[] = []) {
  return headers.map((header, i) => ({ header, width: ws[i]!, align: right.includes(i) ? ('right' as const) : ('left' as const) }));
}
