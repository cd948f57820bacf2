import { requirePermission } from '../../../server/authz';
import { clearFlag } from '../../../server/benchmark/flags';
import { endpoint, uuidParam } from '../../../server/http';

/** Clears a flag (its history stays). */
export const DELETE = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'flags:write');
  await clearFlag(actor, uuidParam(ctx, 'id'), ctx.clientAddress);
  return new Response(null, { status: 204 });
});
