import { z } from 'zod';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readQuery } from '../../../server/http';
import { installationRollups } from '../../../server/measures/rollup';

/** Per installation (`?installation=CODE` for one): walkthroughs by status and the measures' roll-up. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const q = readQuery(ctx, z.object({ installation: z.string().trim().min(1).max(20).optional() }));
  return json({ items: await installationRollups(actor, q.installation) });
});
