import { installationCodeSchema, installationPatchSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { endpoint, errors, json, readJson } from '../../../server/http';
import { getInstallation, updateInstallation } from '../../../server/services/installations';

function code(raw: string | undefined): string {
  const r = installationCodeSchema.safeParse(raw);
  if (!r.success) throw errors.notFound(`No installation with code ${raw}.`);
  return r.data;
}

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  return json(await getInstallation(actor, code(ctx.params.code)));
});

export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'installations:write');
  const c = code(ctx.params.code);
  const patch = await readJson(ctx, installationPatchSchema);
  await updateInstallation(actor, c, patch, ctx.clientAddress);
  return json(await getInstallation(actor, c));
});
