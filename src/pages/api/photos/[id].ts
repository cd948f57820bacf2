import { z } from 'zod';
import { photoPatchSchema } from '../../../lib/field/walkthrough-api';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readJson, readQuery, uuidParam } from '../../../server/http';
import { deletePhoto, photoFile, updatePhoto } from '../../../server/walkthroughs/photos';

/** The photo (`?size=thumb`: its thumbnail; `?download=1`: as an attachment), only within the caller's installations. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const q = readQuery(ctx, z.object({ size: z.enum(['full', 'thumb']).default('full'), download: z.enum(['0', '1']).default('0') }));
  const f = await photoFile(actor, uuidParam(ctx, 'id'), q.size);
  return new Response(f.bytes, {
    headers: {
      'content-type': f.mime,
      'content-length': String(f.bytes.byteLength),
      'content-disposition': `${q.download === '1' ? 'attachment' : 'inline'}; filename="${f.name}"`,
      'cache-control': 'private, max-age=3600',
    },
  });
});

/** `{ tag?, caption?, findingId? }` while the walkthrough is open. */
export const PATCH = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:field');
  return json(await updatePhoto(actor, uuidParam(ctx, 'id'), await readJson(ctx, photoPatchSchema), ctx.clientAddress));
});

export const DELETE = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:field');
  await deletePhoto(actor, uuidParam(ctx, 'id'), ctx.clientAddress);
  return new Response(null, { status: 204 });
});
