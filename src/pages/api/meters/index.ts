import { z } from 'zod';
import { installationCodeSchema, meterInputSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { createMeter, getMeter, listMeters } from '../../../server/services/meters';

const querySchema = z.object({
  installation: installationCodeSchema.optional(),
  building: z.uuid('must be a building id').optional(),
});

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  const q = readQuery(ctx, querySchema);
  return json({ items: await listMeters(actor, { installation: q.installation, buildingId: q.building }) });
});

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:write');
  const input = await readJson(ctx, meterInputSchema);
  const { id } = await createMeter(actor, input, ctx.clientAddress);
  return json(await getMeter(actor, id), { status: 201 });
});
