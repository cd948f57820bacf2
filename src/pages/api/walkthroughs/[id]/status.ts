import { walkthroughStatusChangeSchema } from '../../../../lib/field/walkthrough-api';
import { requireActor } from '../../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../../server/http';
import { requireAny } from '../../../../server/walkthroughs/access';
import { changeWalkthroughStatus } from '../../../../server/walkthroughs/form';
import { getWalkthrough } from '../../../../server/walkthroughs/service';

/**
 * `{ status, acknowledgeIncomplete?, note? }`: in-progress, completed (409 `incomplete` with the
 * open sections unless acknowledged), cancelled or planned again (walkthroughs:plan). → the walkthrough.
 */
export const POST = endpoint(async (ctx) => {
  const actor = requireActor(ctx.locals);
  requireAny(actor, ['walkthroughs:field', 'walkthroughs:plan'], 'change the status of walkthroughs');
  const id = uuidParam(ctx, 'id');
  await changeWalkthroughStatus(actor, id, await readJson(ctx, walkthroughStatusChangeSchema), ctx.clientAddress);
  return json(await getWalkthrough(actor, id));
});
