import { installationInputSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson } from '../../../server/http';
import { createInstallation, listInstallations } from '../../../server/services/installations';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  return json({ items: await listInstallations(actor) });
});

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'installations:write');
  const input = await readJson(ctx, installationInputSchema);
  const created = await createInstallation(actor, input, ctx.clientAddress);
  return json(created, { status: 201 });
});
