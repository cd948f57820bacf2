import { installationCodeSchema, installationTargetSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { setTarget } from '../../../server/benchmark/region';
import { endpoint, errors, json, readJson } from '../../../server/http';

/** `{ baselineFy, reductionPct, targetFy }`: the installation's energy-intensity target. */
export const PUT = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'targets:write');
  const code = installationCodeSchema.safeParse(ctx.params.code);
  if (!code.success) throw errors.notFound();
  await setTarget(actor, code.data, await readJson(ctx, installationTargetSchema), ctx.clientAddress);
  return json({ ok: true });
});
