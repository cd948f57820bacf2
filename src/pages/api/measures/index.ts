import { z } from 'zod';
import { MEASURE_STATUSES } from '../../../lib/field/walkthrough-form';
import { rollUpMeasures } from '../../../lib/savings/measure-rollup';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readQuery } from '../../../server/http';
import { toRollupMeasure } from '../../../server/measures/rollup';
import { listMeasures } from '../../../server/measures/service';

const query = z.object({
  installation: z.string().trim().min(1).max(20).optional(),
  building: z.uuid().optional(),
  walkthrough: z.uuid().optional(),
  status: z
    .string()
    .optional()
    .transform((s) => (s ? s.split(',').map((x) => x.trim()).filter(Boolean) : undefined))
    .pipe(z.array(z.enum(MEASURE_STATUSES, { error: `status: one of ${MEASURE_STATUSES.join(', ')}` })).optional()),
});

/** Measures in the caller's installations, filtered, with their roll-up. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const items = await listMeasures(actor, readQuery(ctx, query));
  return json({ items, rollup: rollUpMeasures(items.map(toRollupMeasure)) });
});
