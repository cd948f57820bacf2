import { z } from 'zod';
import { flagInputSchema } from '../../../lib/schemas/shortlist';
import { requirePermission } from '../../../server/authz';
import { flagBuilding, listFlags } from '../../../server/benchmark/flags';
import { endpoint, json, readJson, readQuery } from '../../../server/http';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'shortlist:read');
  const q = readQuery(ctx, z.object({ building: z.uuid().optional(), open: z.enum(['0', '1']).optional() }));
  return json({ items: await listFlags(actor, { buildingId: q.building, open: q.open === '1' }) });
});

/** `{ buildingId, reason }`: flag a building for a walkthrough; its installation's staff get a mail. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'flags:write');
  return json(await flagBuilding(actor, await readJson(ctx, flagInputSchema), ctx.clientAddress), { status: 201 });
});
