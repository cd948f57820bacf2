/**
 * The life of a walkthrough: planned → in progress (on the first edit of the form) → completed
 * (explicitly, after a look at what is still open) or cancelled; a completed walkthrough can be
 * reopened and a cancelled one planned again. The form can be edited while planned or in progress.
 */
import { LAMP_TYPE_LABELS, SECTION_IDS, SECTION_LABELS, type SectionId, type WalkthroughForm, type WalkthroughStatus } from './walkthrough-form';

export const WALKTHROUGH_STATUS_LABELS: Record<WalkthroughStatus, string> = {
  planned: 'Planned',
  'in-progress': 'In progress',
  completed: 'Completed',
  cancelled: 'Cancelled',
};

/** Allowed moves. `planned → in-progress` also happens by itself on the first saved edit. */
export const WALKTHROUGH_TRANSITIONS: Record<WalkthroughStatus, readonly WalkthroughStatus[]> = {
  planned: ['in-progress', 'cancelled'],
  'in-progress': ['completed', 'cancelled'],
  completed: ['in-progress'],
  cancelled: ['planned'],
};

export function canMoveWalkthrough(from: WalkthroughStatus, to: WalkthroughStatus): boolean {
  return WALKTHROUGH_TRANSITIONS[from].includes(to);
}

/** The form, photos and findings of the walkthrough may change in these statuses. */
export function isFieldWorkOpen(status: WalkthroughStatus): boolean {
  return status === 'planned' || status === 'in-progress';
}

export interface SectionGap {
  section: SectionId;
  label: string;
  /** Not marked complete. */
  notMarked: boolean;
  /** What is missing inside the section, in words ("Row 2 (Corridor): no fixture count"). */
  missing: string[];
}

function rowName(i: number, name: string): string {
  return name ? `Row ${i + 1} (${name})` : `Row ${i + 1}`;
}

function missingFields(i: number, name: string, checks: [unknown, string][]): string[] {
  const gaps = checks.filter(([v]) => v === null || v === undefined || v === '').map(([, label]) => label);
  return gaps.length ? [`${rowName(i, name)}: no ${gaps.join(', no ')}`] : [];
}

/**
 * What is still open before completing: sections not marked complete, and rows lacking the values
 * the calculators and the report need. Advisory: the auditor may complete anyway.
 */
export function completionGaps(form: WalkthroughForm): SectionGap[] {
  const missing: Record<SectionId, string[]> = {
    building: form.building.occupiedHoursPerWeek === null ? ['Occupied hours per week'] : [],
    envelope: [],
    lighting: form.lighting.rows.flatMap((r, i) =>
      missingFields(i, r.location || r.fixture || (r.lampType !== 'other' ? LAMP_TYPE_LABELS[r.lampType] : ''), [
        [r.fixtureCount, 'fixture count'],
        [r.wattsPerFixture, 'watts per fixture'],
        [r.hoursPerYear, 'hours per year'],
      ]),
    ),
    hvac: form.hvac.rows.flatMap((r, i) => missingFields(i, r.tag || r.location, [[r.make, 'make'], [r.model, 'model'], [r.capacity, 'capacity']])),
    plugLoads: form.plugLoads.rows.flatMap((r, i) => missingFields(i, r.item, [[r.count, 'count'], [r.wattsEach, 'watts'], [r.hoursPerYear, 'hours per year']])),
    water: form.water.rows.flatMap((r, i) => missingFields(i, r.location, [[r.count, 'count']])),
    controls: [],
    notes: [],
  };
  return SECTION_IDS.map((id) => ({ section: id, label: SECTION_LABELS[id], notMarked: !form[id].completed, missing: missing[id] })).filter(
    (g) => g.notMarked || g.missing.length > 0,
  );
}
