/**
 * Photo type from the first bytes. Signatures as published: JPEG SOI FF D8 then a marker
 * (ISO/IEC 10918-1 | ITU-T T.81, B.1.1.3 and Table B.1); PNG 89 50 4E 47 0D 0A 1A 0A (PNG
 * specification, W3C, §5.2); WebP "RIFF" <size> "WEBP" (WebP container specification); HEIF
 * `ftyp` with brand "heic" (ISO/IEC 23008-12). Non-images: PDF "%PDF-" (ISO 32000-1 §7.5.2),
 * GIF "GIF89a" (GIF89a specification), AVIF `ftyp` brand "avif" (AV1 Image File Format §9).
 */
import { describe, expect, it } from 'vitest';
import { checkPhoto, sniffImageType, THUMB_MAX_BYTES, THUMB_TYPES } from '../../../src/lib/field/photo-type';
import { PHOTO_MAX_BYTES } from '../../../src/lib/field/walkthrough-form';

const bytes = (...parts: (number[] | string)[]) => Uint8Array.from(parts.flatMap((p) => (typeof p === 'string' ? [...p].map((c) => c.charCodeAt(0)) : p)));
const pad = (b: Uint8Array, n = 64) => Uint8Array.from([...b, ...new Array(n).fill(0)]);

describe('photo type from its bytes', () => {
  it.each([
    ['image/jpeg', bytes([0xff, 0xd8, 0xff, 0xe0], [0x00, 0x10], 'JFIF')],
    ['image/png', bytes([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])],
    ['image/webp', bytes('RIFF', [0x24, 0, 0, 0], 'WEBPVP8 ')],
    ['image/heic', bytes([0, 0, 0, 0x18], 'ftypheic', [0, 0, 0, 0], 'mif1heic')],
  ])('%s', (type, b) => {
    expect(sniffImageType(pad(b))).toBe(type);
    expect(checkPhoto(pad(b))).toMatchObject({ ok: true, mime: type });
  });

  it.each([
    ['a PDF renamed photo.jpg', bytes('%PDF-1.7\n')],
    ['text renamed photo.png', bytes('just some notes about the boiler room')],
    ['a GIF', bytes('GIF89a', [1, 0, 1, 0])],
    ['an AVIF', bytes([0, 0, 0, 0x1c], 'ftypavif', [0, 0, 0, 0], 'avifmif1')],
    ['a truncated JPEG marker', bytes([0xff, 0xd8])],
  ])('refuses %s', (_name, b) => {
    const r = checkPhoto(b);
    expect(r).toMatchObject({ ok: false, reason: 'not-an-image' });
    if (!r.ok) expect(r.message).toMatch(/JPG, PNG, WEBP, HEIC/);
  });

  it('enforces the size limits of the form model', () => {
    const jpeg = bytes([0xff, 0xd8, 0xff, 0xdb]);
    const big = new Uint8Array(PHOTO_MAX_BYTES + 1);
    big.set(jpeg);
    expect(checkPhoto(big)).toMatchObject({ ok: false, reason: 'too-large' });
    expect(checkPhoto(new Uint8Array(0))).toMatchObject({ ok: false, reason: 'empty' });
    const thumb = new Uint8Array(THUMB_MAX_BYTES + 1);
    thumb.set(jpeg);
    expect(checkPhoto(thumb, { maxBytes: THUMB_MAX_BYTES, accepted: THUMB_TYPES })).toMatchObject({ ok: false, reason: 'too-large', message: 'The photo is larger than 192 KB.' });
    const heic = pad(bytes([0, 0, 0, 0x18], 'ftypheic'));
    expect(checkPhoto(heic, { maxBytes: THUMB_MAX_BYTES, accepted: THUMB_TYPES })).toMatchObject({ ok: false, reason: 'not-an-image' });
  });
});
