import { requirePermission } from '../../../../server/authz';
import { endpoint, json, uuidParam } from '../../../../server/http';
import { getLoan } from '../../../../server/kits/loans';

/** One loan with its events (from, to, who, when, note). */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  return json(await getLoan(actor, uuidParam(ctx, 'id')));
});
