import { z } from 'zod';
import { commoditySchema } from '../../../lib/domain';
import { baselineStatusSchema } from '../../../lib/schemas/baselines';
import { installationCodeSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { listBaselines } from '../../../server/baselines/service';
import { endpoint, json, readQuery } from '../../../server/http';

const querySchema = z.object({
  installation: installationCodeSchema.optional(),
  status: baselineStatusSchema.optional(),
  commodity: commoditySchema.optional(),
});

/** Fits and their statistics: `?installation=CODE&status=&commodity=`. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  return json(await listBaselines(actor, readQuery(ctx, querySchema)));
});
