import { kitInputSchema, kitsQuerySchema } from '../../../lib/kits/schemas';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery } from '../../../server/http';
import { createKit, listKits } from '../../../server/kits/kits';

/** `?from=YYYY-MM-DD&to=YYYY-MM-DD` (both or neither): every kit, its instruments, and availability for the range. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:read');
  const q = readQuery(ctx, kitsQuerySchema);
  return json({ items: await listKits(actor, q.from && q.to ? { from: q.from, to: q.to } : undefined) });
});

/** `{ code, name, description?, homeLocation? }` → 201 the kit; 409 when the code is taken. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'kits:manage');
  const input = await readJson(ctx, kitInputSchema);
  return json(await createKit(actor, input, ctx.clientAddress), { status: 201 });
});
