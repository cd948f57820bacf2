import { z } from 'zod';
import { formSaveSchema, walkthroughPlanPatchSchema } from '../../../../lib/field/walkthrough-api';
import { requirePermission } from '../../../../server/authz';
import { endpoint, json, parseWith, readJson, uuidParam } from '../../../../server/http';
import { saveForm } from '../../../../server/walkthroughs/form';
import { getWalkthrough, updatePlan } from '../../../../server/walkthroughs/service';

/** The walkthrough with its form and form version, photos, findings with their measures, and the roll-up. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  return json(await getWalkthrough(actor, uuidParam(ctx, 'id')));
});

/**
 * Two kinds of change:
 * - an autosave `{ formVersion, form: { <section>: {...} } }` (walkthroughs:field) → `{ formVersion, status, updatedAt, progress }`;
 *   409 `stale-version` (with the current version) when the form was saved elsewhere since `formVersion`;
 * - a change of plan `{ title?, plannedOn?, auditorId? }` (walkthroughs:plan) → the walkthrough.
 */
export const PATCH = endpoint(async (ctx) => {
  const id = uuidParam(ctx, 'id');
  const body = await readJson(ctx, z.record(z.string(), z.unknown()));
  if ('formVersion' in body) {
    const actor = requirePermission(ctx.locals, 'walkthroughs:field');
    return json(await saveForm(actor, id, parseWith(formSaveSchema, body), ctx.clientAddress));
  }
  const actor = requirePermission(ctx.locals, 'walkthroughs:plan');
  return json(await updatePlan(actor, id, parseWith(walkthroughPlanPatchSchema, body), ctx.clientAddress));
});
