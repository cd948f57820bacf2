import { instrumentInputSchema, instrumentsQuerySchema } from '../../../lib/kits/schemas';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { createInstrument, listInstruments } from '../../../server/kits/instruments';

/** `?kit=<id>|none&type=&calibration=due-soon|past-due|attention&retired=include` */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  return json({ items: await listInstruments(actor, readQuery(ctx, instrumentsQuerySchema)) });
});

/** `{ kitId|null, type, model?, serial, calibrationDue?, condition?, notes? }` → 201. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:manage');
  const input = await readJson(ctx, instrumentInputSchema);
  return json(await createInstrument(actor, input, ctx.clientAddress), { status: 201 });
});
