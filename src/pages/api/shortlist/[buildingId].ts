import { requirePermission } from '../../../server/authz';
import { shortlistEntry } from '../../../server/benchmark/shortlist';
import { getBuilding } from '../../../server/services/buildings';
import { endpoint, json, uuidParam } from '../../../server/http';

/** One building's rank, score and breakdown in the caller's shortlist. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'shortlist:read');
  const id = uuidParam(ctx, 'buildingId');
  await getBuilding(actor, id); // 404 outside the caller's scope
  return json(await shortlistEntry(actor, id));
});
