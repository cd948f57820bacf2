import { z } from 'zod';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readQuery } from '../../../server/http';
import { buildingVerifiedSavings } from '../../../server/measures/verified-savings';

/**
 * `?building=ID` → per implemented measure and meter of its commodities: the baseline used, the
 * reporting periods (predicted and actual), avoided use, its share of the baseline, its uncertainty
 * at 68 % and 90 %, and the caveats (short reporting period, baseline failing its criteria).
 */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const q = readQuery(ctx, z.object({ building: z.uuid({ error: 'building: a building id' }) }));
  return json(await buildingVerifiedSavings(actor, q.building));
});
