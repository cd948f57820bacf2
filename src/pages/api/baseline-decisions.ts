import { baselineDecisionSchema } from '../../lib/schemas/baselines';
import { requirePermission } from '../../server/authz';
import { decide } from '../../server/baselines/service';
import { endpoint, json, readJson } from '../../server/http';

/** `{ meterId, action: accept | override | reopen, shape?, note }`: the analyst's decision, with a required note. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'baselines:review');
  return json(await decide(actor, await readJson(ctx, baselineDecisionSchema), ctx.clientAddress), { status: 201 });
});
