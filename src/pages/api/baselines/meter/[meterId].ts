import { requirePermission } from '../../../../server/authz';
import { getBaseline } from '../../../../server/baselines/service';
import { endpoint, json, uuidParam } from '../../../../server/http';

/** One meter's baseline: every shape's model, statistics, periods, and the decisions taken. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  return json(await getBaseline(actor, uuidParam(ctx, 'meterId')));
});
