/**
 * The walkthrough's statuses, the completion check and the autosave body. Constructed forms; the
 * rules checked are the product's (planned → in progress → completed or cancelled).
 */
import { describe, expect, it } from 'vitest';
import { emptyWalkthroughForm, lightingRowSchema } from '../../../src/lib/field/walkthrough-form';
import { canMoveWalkthrough, completionGaps, isFieldWorkOpen } from '../../../src/lib/field/walkthrough-lifecycle';
import { formSaveSchema, walkthroughPlanSchema } from '../../../src/lib/field/walkthrough-api';

describe('walkthrough status', () => {
  it('moves planned → in progress → completed, and can be cancelled before it is completed', () => {
    expect(canMoveWalkthrough('planned', 'in-progress')).toBe(true);
    expect(canMoveWalkthrough('in-progress', 'completed')).toBe(true);
    expect(canMoveWalkthrough('planned', 'cancelled')).toBe(true);
    expect(canMoveWalkthrough('in-progress', 'cancelled')).toBe(true);
    expect(canMoveWalkthrough('planned', 'completed')).toBe(false);
    expect(canMoveWalkthrough('completed', 'cancelled')).toBe(false);
    expect(canMoveWalkthrough('completed', 'in-progress')).toBe(true);
    expect(isFieldWorkOpen('completed')).toBe(false);
    expect(isFieldWorkOpen('in-progress')).toBe(true);
  });
});

describe('completion check', () => {
  it('lists sections not marked complete and rows lacking what the calculators need', () => {
    const form = emptyWalkthroughForm();
    form.lighting.completed = true;
    form.lighting.rows.push(lightingRowSchema.parse({ id: 'r1', location: 'Corridor', fixtureCount: 12, wattsPerFixture: null, hoursPerYear: null }));
    const gaps = completionGaps(form);
    expect(gaps.map((g) => g.section)).toEqual(['building', 'envelope', 'lighting', 'hvac', 'plugLoads', 'water', 'controls', 'notes']);
    const lighting = gaps.find((g) => g.section === 'lighting')!;
    expect(lighting.notMarked).toBe(false);
    expect(lighting.missing).toEqual(['Row 1 (Corridor): no watts per fixture, no hours per year']);
  });

  it('is empty once every section is marked and filled', () => {
    const form = emptyWalkthroughForm();
    for (const k of Object.keys(form) as (keyof typeof form)[]) form[k].completed = true;
    form.building.occupiedHoursPerWeek = 50;
    expect(completionGaps(form)).toEqual([]);
  });
});

describe('autosave and planning bodies', () => {
  it('keeps sections that were not sent out of the parsed save (no defaults fill them in)', () => {
    const r = formSaveSchema.parse({ formVersion: 3, form: { notes: { completed: false, text: 'Boiler room locked' } } });
    expect(Object.keys(r.form).filter((k) => r.form[k as keyof typeof r.form] !== undefined)).toEqual(['notes']);
  });

  it('names the bad field: a negative fixture count in row 1 of the lighting inventory', () => {
    const r = formSaveSchema.safeParse({ formVersion: 0, form: { lighting: { rows: [{ id: 'a', fixtureCount: -2 }] } } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path.join('.')).toBe('form.lighting.rows.0.fixtureCount');
  });

  it('refuses a plan without a building or with a date outside 2000–2100', () => {
    expect(walkthroughPlanSchema.safeParse({ title: 'Walk', plannedOn: '2026-12-01' }).success).toBe(false);
    expect(walkthroughPlanSchema.safeParse({ buildingId: '6b1b1f4e-8a51-4c39-9a4f-1c2d3e4f5a6b', title: 'Walk', plannedOn: '1999-12-31' }).success).toBe(false);
    expect(walkthroughPlanSchema.parse({ buildingId: '6b1b1f4e-8a51-4c39-9a4f-1c2d3e4f5a6b', title: 'Walk', plannedOn: '2026-12-01' }).auditorId).toBeNull();
  });
});
