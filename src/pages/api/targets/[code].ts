import { z } from 'zod';
import { installationCodeSchema } from '../../../lib/schemas/inventory';
import { requirePermission } from '../../../server/authz';
import { setTarget } from '../../../server/benchmark/region';
import { endpoint, errors, json, readJson } from '../../../server/http';

const targetSchema = z.object({
  baselineFy: z.number().int().min(1990, 'from FY1990').max(2100),
  reductionPct: z.number().gt(0, 'must be above 0 %').max(100, 'at most 100 %'),
  targetFy: z.number().int().min(1991).max(2100),
});

/** `{ baselineFy, reductionPct, targetFy }`: the installation's energy-intensity target. */
export const PUT = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'targets:write');
  const code = installationCodeSchema.safeParse(ctx.params.code);
  if (!code.success) throw errors.notFound();
  await setTarget(actor, code.data, await readJson(ctx, targetSchema), ctx.clientAddress);
  return json({ ok: true });
});
