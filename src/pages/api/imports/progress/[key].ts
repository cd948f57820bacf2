import { requirePermission } from '../../../../server/authz';
import { endpoint, errors, json } from '../../../../server/http';
import { getProgress, progressKeyOk } from '../../../../server/imports/progress';

/** Progress of an import started with this progressKey (in this server process). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'bills:import');
  const key = ctx.params.key ?? '';
  if (!progressKeyOk(key)) throw errors.notFound();
  const p = getProgress(key);
  if (!p) throw errors.notFound('No import with this progress key is running here.');
  return json(p);
});
