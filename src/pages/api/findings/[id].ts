import { findingPatchSchema } from '../../../lib/field/walkthrough-api';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../server/http';
import { deleteFinding, updateFinding } from '../../../server/walkthroughs/findings';

/** `{ title?, category?, location?, description?, status? (open | dismissed) }` → the finding. */
export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:field');
  return json(await updateFinding(actor, uuidParam(ctx, 'id'), await readJson(ctx, findingPatchSchema), ctx.clientAddress));
});

/** Removes a finding (and its proposed measure); 409 once its measure is approved or implemented. */
export const DELETE = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:field');
  await deleteFinding(actor, uuidParam(ctx, 'id'), ctx.clientAddress);
  return new Response(null, { status: 204 });
});
