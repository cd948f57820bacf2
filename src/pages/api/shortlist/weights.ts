import { priorityWeightsSchema } from '../../../lib/benchmark/priority-weights';
import { requirePermission } from '../../../server/authz';
import { getWeights, saveWeights } from '../../../server/benchmark/shortlist';
import { endpoint, json, readJson } from '../../../server/http';

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'shortlist:read');
  return json(await getWeights());
});

/** The regional manager's weights of the priority terms (any scale; they are divided by their sum). */
export const PUT = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'weights:write');
  const weights = await readJson(ctx, priorityWeightsSchema);
  await saveWeights(actor, weights, ctx.clientAddress);
  return json(await getWeights());
});
