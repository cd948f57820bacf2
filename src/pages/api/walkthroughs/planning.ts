import { z } from 'zod';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readQuery } from '../../../server/http';
import { planningContext } from '../../../server/walkthroughs/planning';

/** `?building=ID` → the building, its open flag, its installation's auditors, open walkthroughs and the instruments to bring with the reasons. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:plan');
  const q = readQuery(ctx, z.object({ building: z.uuid({ error: 'building: a building id' }) }));
  return json(await planningContext(actor, q.building));
});
