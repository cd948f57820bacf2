import { loanRequestSchema, loansQuerySchema } from '../../../lib/kits/schemas';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { listLoans, requestLoan } from '../../../server/kits/loans';

/** `?status=requested,approved&kit=<id>&from&to&mine=1&limit`: loans of the caller's installations (all for region-wide roles). */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  return json({ items: await listLoans(actor, readQuery(ctx, loansQuerySchema)) });
});

/**
 * `{ kitId, start, end, purpose, walkthroughId?, installation? }` (inclusive dates) → 201 the loan
 * (status `requested`); 409 when the kit is held on one of those days (the message names them);
 * 422 when an instrument would be past calibration on a loan day, out of order, or the dates break a rule.
 */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'loans:request');
  const input = await readJson(ctx, loanRequestSchema);
  return json(await requestLoan(actor, input, ctx.clientAddress), { status: 201 });
});
