import { measureStatusChangeSchema } from '../../../../lib/savings/measure-input';
import { requireActor } from '../../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../../server/http';
import { getMeasure, setMeasureStatus } from '../../../../server/measures/service';
import { requireAny } from '../../../../server/walkthroughs/access';

/**
 * `{ status, implementedOn? (with implemented), note? }`: approve or reject (measures:approve),
 * record the implementation (measures:approve or walkthroughs:plan), or undo a decision.
 */
export const POST = endpoint(async (ctx) => {
  const actor = requireActor(ctx.locals);
  requireAny(actor, ['measures:approve', 'walkthroughs:plan'], 'decide on measures');
  const id = uuidParam(ctx, 'id');
  await setMeasureStatus(actor, id, await readJson(ctx, measureStatusChangeSchema), ctx.clientAddress);
  return json(await getMeasure(actor, id));
});
