/**
 * Reads a multipart upload with a hard size cap (OWASP ASVS 4.0.3 12.1.1): the declared length is
 * checked first, and the body stream is counted as it arrives, so an oversized or unannounced
 * body is cut off instead of filling memory.
 */
import type { APIContext } from 'astro';
import { errors, limited } from './http';

/** Room for multipart boundaries and the small text fields beside the file. */
const FORM_OVERHEAD = 256 * 1024;

export interface Upload {
  form: FormData;
  file: File;
}

/**
 * The multipart form and its `file` field.
 * @throws 415 when not multipart, 413 when too large, 400 when there is no file or it is empty.
 */
export async function readUpload(ctx: APIContext, maxFileBytes: number, field = 'file'): Promise<Upload> {
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\b/i.test(type)) throw errors.unsupportedMediaType('Send the file as multipart/form-data.');
  const max = maxFileBytes + FORM_OVERHEAD;
  const declared = Number(ctx.request.headers.get('content-length') ?? 0);
  const mb = Math.round(maxFileBytes / 1024 / 1024);
  if (declared > max) throw errors.tooLarge(`The file is larger than the limit of ${mb} MB.`);
  if (!ctx.request.body) throw errors.badRequest('The request has no body.');
  let form: FormData;
  try {
    const req = new Request(ctx.request.url, { method: 'POST', headers: { 'content-type': type }, body: limited(ctx.request.body, max), duplex: 'half' } as RequestInit);
    form = await req.formData();
  } catch (e) {
    if (e && typeof e === 'object' && 'status' in e) throw e;
    const cause = (e as { cause?: unknown }).cause;
    if (cause && typeof cause === 'object' && 'status' in cause) throw cause;
    throw errors.badRequest('The upload could not be read as a multipart form.');
  }
  const sent = form.get(field);
  if (!(sent instanceof File)) throw errors.badRequest(`${field}: attach a file`, [{ field, message: 'attach a file' }]);
  // The name is stored and logged as text: control characters (U+0000 above all, which
  // PostgreSQL text cannot hold) are dropped from it.
  const name = sent.name.replace(/[\u0000-\u001f\u007f]/g, '');
  const file = name === sent.name ? sent : new File([sent], name, { type: sent.type, lastModified: sent.lastModified });
  if (file.size === 0) throw errors.badRequest(`${field}: the file is empty`, [{ field, message: 'the file is empty' }]);
  if (file.size > maxFileBytes) throw errors.tooLarge(`The file is larger than the limit of ${mb} MB.`);
  return { form, file };
}
