import { kitPatchSchema, kitQuerySchema } from '../../../lib/kits/schemas';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery, uuidParam } from '../../../server/http';
import { getKit, updateKit } from '../../../server/kits/kits';

/** One kit, its instruments and the calendar of its loans (`?from&to`, default 120 days back to 400 ahead). */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  const id = uuidParam(ctx, 'id');
  return json(await getKit(actor, id, readQuery(ctx, kitQuerySchema)));
});

/** `{ code?, name?, description?, homeLocation?, active? }`; taking a kit out of service needs it free of holding loans (409). */
export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:manage');
  const id = uuidParam(ctx, 'id');
  return json(await updateKit(actor, id, await readJson(ctx, kitPatchSchema), ctx.clientAddress));
});
