import { requirePermission } from '../../../server/authz';
import { buildingBaselines } from '../../../server/baselines/service';
import { endpoint, json, uuidParam } from '../../../server/http';

/** Every baseline of one building (one per meter), with the full fit and statistics. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  return json(await buildingBaselines(actor, uuidParam(ctx, 'buildingId')));
});
