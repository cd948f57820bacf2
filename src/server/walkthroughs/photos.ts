/**
 * Walkthrough photos: upload with a tag (and optionally a finding), checked by their bytes against
 * the form model's types and size; read back only through the actor's scope; retagged, moved to a
 * finding, or removed while the field work is open.
 */
import { and, asc, eq } from 'drizzle-orm';
import type { Db, Tx } from '../../db/client';
import { getDb } from '../../db/client';
import { finding, photo } from '../../db/schema';
import { checkPhoto, THUMB_MAX_BYTES, THUMB_TYPES } from '../../lib/field/photo-type';
import { isFieldWorkOpen, WALKTHROUGH_STATUS_LABELS } from '../../lib/field/walkthrough-lifecycle';
import type { PhotoTag } from '../../lib/field/walkthrough-form';
import { logActivity } from '../activity';
import { scopeToInstallations, type Actor } from '../authz';
import { errors, HttpError } from '../http';
import { walkthroughRef, type WalkthroughRef } from './access';
import { findThumb, readStored, removeStored, storePhoto } from './photo-store';

export interface PhotoItem {
  id: string;
  tag: PhotoTag;
  caption: string;
  mime: string;
  bytes: number;
  findingId: string | null;
  hasThumb: boolean;
  createdAt: string;
  url: string;
  thumbUrl: string | null;
}

export async function photosOf(db: Db | Tx, walkthroughId: string): Promise<PhotoItem[]> {
  const rows = await db.select().from(photo).where(eq(photo.walkthroughId, walkthroughId)).orderBy(asc(photo.createdAt));
  const out: PhotoItem[] = [];
  for (const r of rows) {
    let thumb: string | null = null;
    try {
      thumb = await findThumb(walkthroughId, r.storedName);
    } catch {
      thumb = null; // no data folder: photos are listed without thumbnails
    }
    out.push({
      id: r.id,
      tag: r.tag as PhotoTag,
      caption: r.caption,
      mime: r.mime,
      bytes: r.bytes,
      findingId: r.findingId,
      hasThumb: thumb !== null,
      createdAt: r.createdAt.toISOString(),
      url: `/api/photos/${r.id}`,
      thumbUrl: thumb ? `/api/photos/${r.id}?size=thumb` : null,
    });
  }
  return out;
}

function mustBeOpen(w: WalkthroughRef): void {
  if (!isFieldWorkOpen(w.status)) throw errors.conflict(`This walkthrough is ${WALKTHROUGH_STATUS_LABELS[w.status].toLowerCase()}: reopen it to change its photos.`, { reason: 'not-editable' });
}

async function checkFinding(db: Db | Tx, walkthroughId: string, findingId: string | null): Promise<void> {
  if (!findingId) return;
  const [f] = await db.select({ id: finding.id }).from(finding).where(and(eq(finding.id, findingId), eq(finding.walkthroughId, walkthroughId)));
  if (!f) throw errors.unprocessable('That finding is not part of this walkthrough.', [{ field: 'findingId', message: 'not a finding of this walkthrough' }]);
}

export interface PhotoUpload {
  bytes: Uint8Array;
  thumb: Uint8Array | null;
  tag: PhotoTag;
  caption: string;
  findingId: string | null;
}

/**
 * Stores a photo. @throws 413 over the size limit, 415 when the bytes are not an accepted image
 * type (whatever the name or declared type), 409 when the walkthrough is closed.
 */
export async function addPhoto(actor: Actor, walkthroughId: string, up: PhotoUpload, ip = ''): Promise<PhotoItem> {
  const db = await getDb();
  const w = await walkthroughRef(db, actor, walkthroughId);
  mustBeOpen(w);
  await checkFinding(db, walkthroughId, up.findingId);
  const check = checkPhoto(up.bytes);
  if (!check.ok) {
    if (check.reason === 'too-large') throw errors.tooLarge(check.message);
    if (check.reason === 'empty') throw errors.badRequest(`file: ${check.message}`, [{ field: 'file', message: check.message }]);
    throw errors.unsupportedMediaType(check.message);
  }
  let thumb: { extension: string; bytes: Uint8Array } | null = null;
  if (up.thumb) {
    const t = checkPhoto(up.thumb, { maxBytes: THUMB_MAX_BYTES, accepted: THUMB_TYPES });
    if (!t.ok) throw new HttpError(t.reason === 'too-large' ? 413 : 415, t.reason === 'too-large' ? 'too_large' : 'unsupported_media_type', `Thumbnail: ${t.message}`, [{ field: 'thumb', message: t.message }]);
    thumb = { extension: t.extension, bytes: up.thumb };
  }
  const storedName = await storePhoto(walkthroughId, check.extension, up.bytes, thumb);
  try {
    const [row] = await db
      .insert(photo)
      .values({ walkthroughId, installationId: w.installationId, findingId: up.findingId, tag: up.tag, caption: up.caption, mime: check.mime, bytes: up.bytes.length, storedName, uploadedBy: actor.id })
      .returning({ id: photo.id });
    await logActivity({ action: 'photo.add', userId: actor.id, actor: actor.email, entityType: 'photo', entityId: row!.id, installationId: w.installationId, ip, details: { walkthroughId, tag: up.tag, mime: check.mime, bytes: up.bytes.length } });
    return (await photosOf(db, walkthroughId)).find((p) => p.id === row!.id)!;
  } catch (e) {
    await removeStored(walkthroughId, storedName);
    throw e;
  }
}

async function photoRow(db: Db | Tx, actor: Actor, id: string) {
  const [row] = await db.select().from(photo).where(and(eq(photo.id, id), scopeToInstallations(actor, photo.installationId)));
  if (!row) throw errors.notFound('No such photo in your installations.');
  return row;
}

/** The photo's bytes (or its thumbnail's) if the actor may see it. @throws 404 */
export async function photoFile(actor: Actor, id: string, size: 'full' | 'thumb'): Promise<{ bytes: Uint8Array<ArrayBuffer>; mime: string; name: string }> {
  const db = await getDb();
  const row = await photoRow(db, actor, id);
  const name = size === 'thumb' ? await findThumb(row.walkthroughId, row.storedName) : row.storedName;
  const bytes = name ? await readStored(row.walkthroughId, name) : null;
  if (!name || !bytes) throw errors.notFound(size === 'thumb' ? 'This photo has no thumbnail.' : 'The photo file is missing from the data folder.');
  const ext = name.split('.').pop()!;
  const mime = size === 'thumb' ? ({ jpg: 'image/jpeg', png: 'image/png', webp: 'image/webp' } as Record<string, string>)[ext]! : row.mime;
  return { bytes, mime, name: `photo-${row.tag}-${id.slice(0, 8)}.${ext}` };
}

export async function updatePhoto(actor: Actor, id: string, patch: { tag?: PhotoTag | undefined; caption?: string | undefined; findingId?: string | null | undefined }, ip = ''): Promise<PhotoItem> {
  const db = await getDb();
  const row = await photoRow(db, actor, id);
  mustBeOpen(await walkthroughRef(db, actor, row.walkthroughId));
  if (patch.findingId !== undefined) await checkFinding(db, row.walkthroughId, patch.findingId);
  const set = Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined));
  await db.update(photo).set(set).where(eq(photo.id, id));
  await logActivity({ action: 'photo.update', userId: actor.id, actor: actor.email, entityType: 'photo', entityId: id, installationId: row.installationId, ip, details: set });
  return (await photosOf(db, row.walkthroughId)).find((p) => p.id === id)!;
}

export async function deletePhoto(actor: Actor, id: string, ip = ''): Promise<void> {
  const db = await getDb();
  const row = await photoRow(db, actor, id);
  mustBeOpen(await walkthroughRef(db, actor, row.walkthroughId));
  await db.delete(photo).where(eq(photo.id, id));
  await removeStored(row.walkthroughId, row.storedName);
  await logActivity({ action: 'photo.delete', userId: actor.id, actor: actor.email, entityType: 'photo', entityId: id, installationId: row.installationId, ip, details: { walkthroughId: row.walkthroughId, tag: row.tag } });
}
