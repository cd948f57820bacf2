import { z } from 'zod';
import { useTypeSchema } from '../../../lib/domain';
import { buildingInputSchema, installationCodeSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { BUILDING_SORTS, createBuilding, getBuilding, listBuildings } from '../../../server/services/buildings';

const querySchema = z.object({
  installation: installationCodeSchema.optional(),
  q: z.string().trim().max(100).optional(),
  useType: useTypeSchema.optional(),
  sort: z.enum(BUILDING_SORTS).optional(),
  archived: z.enum(['include', 'exclude']).optional(),
});

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  const q = readQuery(ctx, querySchema);
  const items = await listBuildings(actor, { ...q, includeArchived: q.archived === 'include' });
  return json({ items });
});

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:write');
  const input = await readJson(ctx, buildingInputSchema);
  const { id } = await createBuilding(actor, input, ctx.clientAddress);
  return json(await getBuilding(actor, id), { status: 201 });
});
