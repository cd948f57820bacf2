import { requirePermission } from '../../../server/authz';
import { installationFigures } from '../../../server/benchmark/region';
import { endpoint, json } from '../../../server/http';

/** Per installation: intensities, fiscal-year history, target path, progress and projection. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  return json({ items: await installationFigures(actor) });
});
