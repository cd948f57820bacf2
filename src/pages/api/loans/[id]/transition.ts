import { loanTransitionSchema } from '../../../../lib/kits/schemas';
import { requirePermission } from '../../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../../server/http';
import { transitionLoan } from '../../../../server/kits/loan-transitions';

/**
 * `{ to, note?, conditions? }`: move the loan to its next status. Who may is decided per move
 * (requester cancels, borrower marks in use, custodian the rest): 403 otherwise; 409 for a move
 * the loan's status does not allow; 422 when approving or shipping a kit with an instrument past
 * calibration or out of order.
 */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  const id = uuidParam(ctx, 'id');
  const input = await readJson(ctx, loanTransitionSchema);
  return json(await transitionLoan(actor, id, input, ctx.clientAddress));
});
