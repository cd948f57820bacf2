import { userPatchSchema } from '../../../lib/schemas/users';
import { requirePermission } from '../../../server/authz';
import { endpoint, errors, json, readJson } from '../../../server/http';
import { listUsers, updateUser } from '../../../server/services/users';

export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'users:manage');
  const id = ctx.params.id ?? '';
  if (!/^[A-Za-z0-9_-]{8,64}$/.test(id)) throw errors.notFound('No such account.');
  await updateUser(actor, id, await readJson(ctx, userPatchSchema), ctx.clientAddress);
  const updated = (await listUsers()).find((u) => u.id === id);
  return json(updated);
});
