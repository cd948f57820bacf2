import { requirePermission } from '../../../../server/authz';
import { endpoint, json, uuidParam } from '../../../../server/http';
import { getDb } from '../../../../db/client';
import { walkthroughRef } from '../../../../server/walkthroughs/access';
import { suggestionsForBuilding } from '../../../../server/walkthroughs/signature';

/** The instruments to bring to this walkthrough, each with the reasons read from the building's signature. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const w = await walkthroughRef(await getDb(), actor, uuidParam(ctx, 'id'));
  return json(await suggestionsForBuilding(actor, w.buildingId, w.id));
});
