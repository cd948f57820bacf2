/**
 * Photo files on disk, beside the database: `<data folder>/files/photos/<walkthrough id>/<uuid>.<ext>`
 * and the browser-made thumbnail `<uuid>.thumb.<ext>`. Names are made here, never taken from the
 * upload; writes go to a temporary name first and are renamed into place.
 */
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { filesDir } from '../../db/paths';
import { HttpError } from '../http';

const NAME = /^[0-9a-f-]{36}(\.thumb)?\.(jpg|png|webp|heic)$/;
const ID = /^[0-9a-f-]{36}$/;

function root(): string {
  const dir = filesDir();
  if (!dir) throw new HttpError(503, 'no_storage', 'Photos cannot be stored on this server: it has no data folder (set PLUMBLINE_DATA_DIR).');
  return join(dir, 'photos');
}

function folder(walkthroughId: string): string {
  if (!ID.test(walkthroughId)) throw new Error(`bad walkthrough id ${walkthroughId}`);
  return join(root(), walkthroughId);
}

export function thumbName(storedName: string, thumbExtension: string): string {
  return storedName.replace(/\.[a-z]+$/, `.thumb.${thumbExtension}`);
}

async function put(dir: string, name: string, bytes: Uint8Array): Promise<void> {
  const tmp = join(dir, `.${name}.${process.pid}.tmp`);
  await writeFile(tmp, bytes, { flag: 'wx' });
  await rename(tmp, join(dir, name));
}

/** Stores a photo (and its thumbnail); returns the stored name. */
export async function storePhoto(walkthroughId: string, extension: string, bytes: Uint8Array, thumb: { extension: string; bytes: Uint8Array } | null): Promise<string> {
  const dir = folder(walkthroughId);
  await mkdir(dir, { recursive: true });
  const name = `${randomUUID()}.${extension}`;
  await put(dir, name, bytes);
  if (thumb) await put(dir, thumbName(name, thumb.extension), thumb.bytes);
  return name;
}

/** The stored thumbnail's name, if there is one. */
export async function findThumb(walkthroughId: string, storedName: string): Promise<string | null> {
  const stem = storedName.replace(/\.[a-z]+$/, '.thumb.');
  const dir = folder(walkthroughId);
  for (const ext of ['jpg', 'webp', 'png']) if (existsSync(join(dir, stem + ext))) return stem + ext;
  return null;
}

export async function readStored(walkthroughId: string, name: string): Promise<Uint8Array<ArrayBuffer> | null> {
  if (!NAME.test(name)) return null;
  try {
    return new Uint8Array(await readFile(join(folder(walkthroughId), name)));
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw e;
  }
}

/** Removes a photo and its thumbnail. */
export async function removeStored(walkthroughId: string, storedName: string): Promise<void> {
  if (!NAME.test(storedName)) return;
  const dir = folder(walkthroughId);
  const stem = storedName.replace(/\.[a-z]+$/, '');
  const names = existsSync(dir) ? await readdir(dir) : [];
  for (const n of names) if (n === storedName || n.startsWith(`${stem}.thumb.`)) await rm(join(dir, n), { force: true });
}
