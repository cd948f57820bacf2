import { requirePermission } from '../../../server/authz';
import { endpoint, uuidParam } from '../../../server/http';
import { deleteMapping } from '../../../server/imports/mappings';

export const DELETE = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:import');
  await deleteMapping(actor, uuidParam(ctx, 'id'));
  return new Response(null, { status: 204 });
});
