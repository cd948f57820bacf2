import { z } from 'zod';
import { WALKTHROUGH_STATUSES } from '../../../lib/field/walkthrough-form';
import { walkthroughPlanSchema } from '../../../lib/field/walkthrough-api';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { getWalkthrough, listWalkthroughs, planWalkthrough } from '../../../server/walkthroughs/service';

const listQuery = z.object({
  /** One status or several, comma-separated. */
  status: z
    .string()
    .optional()
    .transform((s) => (s ? s.split(',').map((x) => x.trim()).filter(Boolean) : undefined))
    .pipe(z.array(z.enum(WALKTHROUGH_STATUSES, { error: `status: one of ${WALKTHROUGH_STATUSES.join(', ')}` })).optional()),
  installation: z.string().trim().min(1).max(20).optional(),
  building: z.uuid().optional(),
});

/**
 * `?status=planned,in-progress&installation=CODE&building=ID` → `{ items: [{ id, title, buildingId,
 * buildingNumber, buildingName, installationCode, plannedOn, auditor, status, progress, findings,
 * measures, loan }] }`, newest planned date first.
 */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const q = readQuery(ctx, listQuery);
  return json({ items: await listWalkthroughs(actor, q) });
});

/** `{ buildingId, title, plannedOn, auditorId?, flagId? }` → 201 with the new walkthrough. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:plan');
  const input = await readJson(ctx, walkthroughPlanSchema);
  const { id } = await planWalkthrough(actor, input, ctx.clientAddress);
  return json(await getWalkthrough(actor, id), { status: 201, headers: { location: `/api/walkthroughs/${id}` } });
});
