import { requirePermission } from '../../../server/authz';
import { endpoint, json, uuidParam } from '../../../server/http';
import { getMeasure } from '../../../server/measures/service';

/** The measure, its economics with the discount rate used, and its history (who moved it, when, why). */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  return json(await getMeasure(actor, uuidParam(ctx, 'id')));
});
