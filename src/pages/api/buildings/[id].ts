import { buildingPatchSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../server/http';
import { buildingMeters, getBuilding, updateBuilding } from '../../../server/services/buildings';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  const id = uuidParam(ctx, 'id');
  const building = await getBuilding(actor, id);
  return json({ ...building, meters: await buildingMeters(actor, id) });
});

export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:write');
  const id = uuidParam(ctx, 'id');
  const patch = await readJson(ctx, buildingPatchSchema);
  return json(await updateBuilding(actor, id, patch, ctx.clientAddress));
});
