import { z } from 'zod';
import { installationCodeSchema } from '../../../lib/schemas/inventory';
import { savedMappingSchema } from '../../../lib/schemas/imports';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { listMappings, saveMapping } from '../../../server/imports/mappings';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:import');
  const { installation } = readQuery(ctx, z.object({ installation: installationCodeSchema }));
  return json({ items: await listMappings(actor, installation) });
});

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:import');
  return json(await saveMapping(actor, await readJson(ctx, savedMappingSchema)), { status: 201 });
});
