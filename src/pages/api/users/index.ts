import { userInputSchema } from '../../../lib/schemas/users';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson } from '../../../server/http';
import { createUser, listUsers } from '../../../server/services/users';

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'users:manage');
  return json({ items: await listUsers() });
});

export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'users:manage');
  const input = await readJson(ctx, userInputSchema);
  return json(await createUser(actor, input, undefined, ctx.clientAddress), { status: 201 });
});
