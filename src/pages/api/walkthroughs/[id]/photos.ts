import { getDb } from '../../../../db/client';
import { PHOTO_MAX_BYTES } from '../../../../lib/field/walkthrough-form';
import { photoFieldsSchema } from '../../../../lib/field/walkthrough-api';
import { requirePermission } from '../../../../server/authz';
import { endpoint, json, parseWith, uuidParam } from '../../../../server/http';
import { readUpload } from '../../../../server/upload';
import { walkthroughRef } from '../../../../server/walkthroughs/access';
import { addPhoto, photosOf } from '../../../../server/walkthroughs/photos';

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const db = await getDb();
  const w = await walkthroughRef(db, actor, uuidParam(ctx, 'id'));
  return json({ items: await photosOf(db, w.id) });
});

/**
 * multipart: `file` (JPEG, PNG, WebP or HEIC by its bytes, at most 15 MB), `tag`, `caption`?,
 * `findingId`?, `thumb`? (a small JPEG/PNG/WebP the browser made) → 201 with the photo.
 * 413 too large, 415 not an accepted image whatever its name says.
 */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'walkthroughs:field');
  const id = uuidParam(ctx, 'id');
  await walkthroughRef(await getDb(), actor, id); // scope first: nothing is read from a foreign upload
  const { form, file } = await readUpload(ctx, PHOTO_MAX_BYTES);
  const fields = parseWith(photoFieldsSchema, {
    tag: form.get('tag') ?? undefined,
    caption: typeof form.get('caption') === 'string' ? form.get('caption') : undefined,
    findingId: form.get('findingId') || null,
  });
  const thumb = form.get('thumb');
  const photo = await addPhoto(
    actor,
    id,
    { bytes: new Uint8Array(await file.arrayBuffer()), thumb: thumb instanceof File && thumb.size > 0 ? new Uint8Array(await thumb.arrayBuffer()) : null, ...fields },
    ctx.clientAddress,
  );
  return json(photo, { status: 201 });
});
