/**
 * What a walkthrough photo really is, read from its first bytes rather than from its name or the
 * type the browser declared, and whether it may be stored (type and size limits of the form model).
 *
 * Signatures:
 * - JPEG: SOI marker FF D8 followed by a marker (FF) — ISO/IEC 10918-1 (ITU-T T.81) B.1.1.3;
 * - PNG: 89 50 4E 47 0D 0A 1A 0A — PNG specification (W3C, 3rd ed.) §5.2;
 * - WebP: "RIFF" size "WEBP" — WebP container specification (Google), RIFF header;
 * - HEIC: an ISO base media file whose `ftyp` box names a HEIF image brand (heic, heix, hevc,
 *   hevx, heim, heis, mif1, msf1) — ISO/IEC 23008-12 Annex B brands [secondary].
 */
import { PHOTO_MAX_BYTES, PHOTO_TYPES } from './walkthrough-form';

export type PhotoType = (typeof PHOTO_TYPES)[number];

/** File extension stored on disk for each accepted type. */
export const PHOTO_EXTENSIONS: Record<PhotoType, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/heic': 'heic',
};

/** Thumbnails are made by the browser (canvas → JPEG or WebP) and kept small. */
export const THUMB_MAX_BYTES = 192 * 1024; // fits in the upload's room for form fields (src/server/upload.ts)
export const THUMB_TYPES: readonly PhotoType[] = ['image/jpeg', 'image/png', 'image/webp'];

const HEIF_BRANDS = new Set(['heic', 'heix', 'hevc', 'hevx', 'heim', 'heis', 'mif1', 'msf1']);

function ascii(bytes: Uint8Array, from: number, length: number): string {
  let s = '';
  for (let i = from; i < from + length && i < bytes.length; i++) s += String.fromCharCode(bytes[i]!);
  return s;
}

/**
 * The image type the bytes start with, or null.
 * @example sniffImageType(Uint8Array.of(0xff, 0xd8, 0xff, 0xe0)) // 'image/jpeg'
 */
export function sniffImageType(bytes: Uint8Array): PhotoType | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'image/jpeg';
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (bytes.length >= 8 && png.every((b, i) => bytes[i] === b)) return 'image/png';
  if (bytes.length >= 12 && ascii(bytes, 0, 4) === 'RIFF' && ascii(bytes, 8, 4) === 'WEBP') return 'image/webp';
  if (bytes.length >= 12 && ascii(bytes, 4, 4) === 'ftyp' && HEIF_BRANDS.has(ascii(bytes, 8, 4))) return 'image/heic';
  return null;
}

export type PhotoCheck =
  | { ok: true; mime: PhotoType; extension: string }
  | { ok: false; reason: 'empty' | 'too-large' | 'not-an-image'; message: string };

/**
 * Checks an upload against the form model's limits: not empty, at most `maxBytes`, and bytes that
 * are one of the accepted image types whatever the name or declared type say.
 */
export function checkPhoto(bytes: Uint8Array, options: { maxBytes?: number; accepted?: readonly PhotoType[] } = {}): PhotoCheck {
  const max = options.maxBytes ?? PHOTO_MAX_BYTES;
  const accepted = options.accepted ?? PHOTO_TYPES;
  if (bytes.length === 0) return { ok: false, reason: 'empty', message: 'The file is empty.' };
  if (bytes.length > max) return { ok: false, reason: 'too-large', message: `The photo is larger than ${max >= 1024 * 1024 ? `${Math.round(max / 1024 / 1024)} MB` : `${Math.round(max / 1024)} KB`}.` };
  const mime = sniffImageType(bytes);
  if (mime === null || !accepted.includes(mime)) {
    const names = accepted.map((t) => PHOTO_EXTENSIONS[t].toUpperCase()).join(', ');
    return { ok: false, reason: 'not-an-image', message: `The file is not a ${names} image, whatever its name says.` };
  }
  return { ok: true, mime, extension: PHOTO_EXTENSIONS[mime] };
}
