/**
 * Reads a walkthrough photo from the data folder for the PDF: only files inside the folder
 * (no path escapes), within the upload size limit, whose first bytes are the JPEG or PNG
 * signature their type claims. Anything else is null, and the report lists the photo instead.
 */
import { readFileSync, statSync } from 'node:fs';
import { isAbsolute, join, resolve, sep } from 'node:path';
import { PHOTO_MAX_BYTES } from '../../lib/field/walkthrough-form';
import { filesDir } from '../../db/paths';

// Signatures: PNG (W3C PNG Specification §5.2), JPEG SOI marker followed by a marker (ITU T.81 Annex B).
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG_SIGNATURE = [0xff, 0xd8, 0xff];

function startsWith(bytes: Buffer, signature: readonly number[]): boolean {
  return signature.every((b, i) => bytes[i] === b);
}

/** The stored photo's bytes when it is a readable JPEG or PNG inside the data folder, else null. */
export function readPhotoFile(storedName: string, mime: string, base: string | null = filesDir()): Buffer | null {
  if (!base || !storedName || isAbsolute(storedName) || storedName.split(/[\\/]/).includes('..')) return null;
  const root = resolve(base);
  for (const candidate of [join(root, 'photos', storedName), join(root, storedName)]) {
    const path = resolve(candidate);
    if (!path.startsWith(root + sep)) continue;
    try {
      const st = statSync(path);
      if (!st.isFile() || st.size > PHOTO_MAX_BYTES) continue;
      const bytes = readFileSync(path);
      if (mime === 'image/png' && startsWith(bytes, PNG_SIGNATURE)) return bytes;
      if (mime === 'image/jpeg' && startsWith(bytes, JPEG_SIGNATURE)) return bytes;
    } catch {
      // Not there: try the next place, then give up and let the report list the photo.
    }
  }
  return null;
}
