import { baselinePeriodSchema } from '../../lib/schemas/baselines';
import { requirePermission } from '../../server/authz';
import { setPeriod } from '../../server/baselines/service';
import { endpoint, json, readJson } from '../../server/http';

/** `{ meterId, start, end, note }`: choose the baseline period of a meter and refit it. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'baselines:review');
  return json(await setPeriod(actor, await readJson(ctx, baselinePeriodSchema), ctx.clientAddress), { status: 201 });
});
