import { meterPatchSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../server/http';
import { getMeter, updateMeter } from '../../../server/services/meters';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  return json(await getMeter(actor, uuidParam(ctx, 'id')));
});

export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:write');
  const id = uuidParam(ctx, 'id');
  await updateMeter(actor, id, await readJson(ctx, meterPatchSchema), ctx.clientAddress);
  return json(await getMeter(actor, id));
});
