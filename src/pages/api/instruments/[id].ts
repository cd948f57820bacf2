import { instrumentPatchSchema } from '../../../lib/kits/schemas';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../server/http';
import { instrumentHistory } from '../../../server/kits/instrument-history';
import { getInstrument, updateInstrument } from '../../../server/kits/instruments';

/** One instrument with its history (kit moves, calibration and condition changes, loans), newest first. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  const id = uuidParam(ctx, 'id');
  const item = await getInstrument(actor, id);
  return json({ ...item, history: await instrumentHistory(actor, id) });
});

/** Any of `{ kitId, type, model, serial, calibrationDue, condition, notes }`; `kitId: null` takes it out of its kit. */
export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:manage');
  const id = uuidParam(ctx, 'id');
  return json(await updateInstrument(actor, id, await readJson(ctx, instrumentPatchSchema), ctx.clientAddress));
});
