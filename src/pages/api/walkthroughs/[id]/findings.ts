import { findingInputSchema } from '../../../../lib/field/walkthrough-api';
import { getDb } from '../../../../db/client';
import { requirePermission } from '../../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../../server/http';
import { walkthroughRef } from '../../../../server/walkthroughs/access';
import { createFinding, findingsOf } from '../../../../server/walkthroughs/findings';

/** The walkthrough's findings, each with its photos and measure. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const db = await getDb();
  const w = await walkthroughRef(db, actor, uuidParam(ctx, 'id'));
  return json({ items: await findingsOf(db, w.id) });
});

/** `{ title, category, location?, description? }` → 201 with the finding. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:field');
  const f = await createFinding(actor, uuidParam(ctx, 'id'), await readJson(ctx, findingInputSchema), ctx.clientAddress);
  return json(f, { status: 201 });
});
