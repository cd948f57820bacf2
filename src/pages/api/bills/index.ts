import { z } from 'zod';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readQuery } from '../../../server/http';
import { listBills } from '../../../server/services/meters';

const querySchema = z.object({ meter: z.uuid('must be a meter id') });

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  const { meter } = readQuery(ctx, querySchema);
  return json({ items: await listBills(actor, meter) });
});
