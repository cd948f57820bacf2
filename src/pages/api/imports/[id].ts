import { requirePermission } from '../../../server/authz';
import { endpoint, json, uuidParam } from '../../../server/http';
import { getImport, undoCommittedImport } from '../../../server/imports/service';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  return json(await getImport(actor, uuidParam(ctx, 'id')));
});

/** Undoes a committed import: its new bills are removed and the bills it changed restored. */
export const DELETE = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:import');
  return json(await undoCommittedImport(actor, uuidParam(ctx, 'id'), ctx.clientAddress));
});
