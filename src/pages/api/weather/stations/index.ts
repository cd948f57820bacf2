import { stationInputSchema } from '../../../../lib/schemas/weather';
import { requirePermission } from '../../../../server/authz';
import { endpoint, json, readJson } from '../../../../server/http';
import { createStation, listStations } from '../../../../server/weather/stations';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  return json({ items: await listStations(actor) });
});

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'weather:write');
  return json(await createStation(actor, await readJson(ctx, stationInputSchema), ctx.clientAddress), { status: 201 });
});
