/**
 * The API's one error shape, `{ error: { code, message, details } }`, and the wrapper every
 * endpoint uses: it turns thrown HttpErrors and validation failures into that shape, and any
 * other failure into a 500 with a support id (the cause goes to the server log, not the client).
 */
import { randomUUID } from 'node:crypto';
import type { APIContext, APIRoute } from 'astro';
import { z, type ZodType } from 'zod';
import { MAX_JSON_BYTES } from './config';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: unknown = null,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const errors = {
  badRequest: (message: string, details: unknown = null) => new HttpError(400, 'invalid_request', message, details),
  unauthorized: () => new HttpError(401, 'unauthenticated', 'Sign in to continue.'),
  forbidden: (message = 'You may not do this.') => new HttpError(403, 'forbidden', message),
  notFound: (message = 'Not found.') => new HttpError(404, 'not_found', message),
  conflict: (message: string, details: unknown = null) => new HttpError(409, 'conflict', message, details),
  tooLarge: (message: string) => new HttpError(413, 'too_large', message),
  unsupportedMediaType: (message: string) => new HttpError(415, 'unsupported_media_type', message),
  unprocessable: (message: string, details: unknown = null) => new HttpError(422, 'unprocessable', message, details),
};

export function json(data: unknown, init: ResponseInit = {}): Response {
  const headers = new Headers(init.headers);
  headers.set('content-type', 'application/json; charset=utf-8');
  headers.set('cache-control', 'no-store');
  return new Response(JSON.stringify(data), { ...init, headers });
}

/** A JSON answer already serialized (UTF-8), e.g. from a cache. */
export function jsonBytes(body: Uint8Array<ArrayBuffer>, init: ResponseInit = {}): Response {
  const headers = new Headers(init.headers);
  headers.set('content-type', 'application/json; charset=utf-8');
  headers.set('content-length', String(body.byteLength));
  headers.set('cache-control', 'no-store');
  return new Response(body, { ...init, headers });
}

export function errorResponse(e: HttpError): Response {
  return json({ error: { code: e.code, message: e.message, details: e.details } }, { status: e.status });
}

/** Zod issues as `{ field, message }` pairs, and one sentence naming the fields. */
export function describeZodError(error: z.ZodError): { message: string; details: { field: string; message: string }[] } {
  const details = error.issues.map((i) => ({ field: i.path.join('.') || '(body)', message: i.message }));
  const message = details.map((d) => `${d.field}: ${d.message}`).join('; ');
  return { message: `Invalid input — ${message}`, details };
}

/**
 * The path of the first string (value or key) in `value` that holds U+0000, or null. PostgreSQL
 * text and jsonb cannot store that character (PostgreSQL docs §8.3 and §8.14), so input holding
 * it is refused here rather than failing in the database. Iterative: a deeply nested body cannot
 * exhaust the stack.
 */
export function findNulPath(value: unknown): string | null {
  interface Item {
    v: unknown;
    key: string;
    parent: Item | null;
  }
  const path = (item: Item): string => {
    const keys: string[] = [];
    for (let at: Item | null = item; at !== null && at.parent !== null; at = at.parent) keys.push(at.key);
    return keys.reverse().join('.') || '(body)';
  };
  const stack: Item[] = [{ v: value, key: '', parent: null }];
  while (stack.length > 0) {
    const item = stack.pop()!;
    if (typeof item.v === 'string') {
      if (item.v.includes('\u0000')) return path(item);
    } else if (item.v !== null && typeof item.v === 'object') {
      for (const [k, v] of Object.entries(item.v)) {
        const next = { v, key: k, parent: item };
        if (k.includes('\u0000')) return path(next);
        stack.push(next);
      }
    }
  }
  return null;
}

/** Parses a value with a schema; @throws 400 naming each bad field (a NUL character included). */
export function parseWith<T>(schema: ZodType<T>, value: unknown): T {
  const nul = findNulPath(value);
  if (nul !== null) {
    const message = 'contains the NUL character (U+0000), which cannot be stored';
    throw errors.badRequest(`Invalid input — ${nul}: ${message}`, [{ field: nul, message }]);
  }
  const r = schema.safeParse(value);
  if (!r.success) {
    const { message, details } = describeZodError(r.error);
    throw errors.badRequest(message, details);
  }
  return r.data;
}

/**
 * The body stream, counted as it arrives: past `max` bytes it is cancelled with a 413, so an
 * oversized or unannounced (chunked) body is cut off instead of filling memory (ASVS 4.0.3 12.1.1).
 */
export function limited(body: ReadableStream<Uint8Array>, max: number): ReadableStream<Uint8Array> {
  let seen = 0;
  const reader = body.getReader();
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      const { done, value } = await reader.read();
      if (done) return controller.close();
      seen += value.byteLength;
      if (seen > max) {
        await reader.cancel();
        return controller.error(errors.tooLarge(max >= 1024 * 1024 ? `The upload is larger than ${Math.round(max / 1024 / 1024)} MB.` : `The body is larger than ${max} bytes.`));
      }
      controller.enqueue(value);
    },
    cancel: (r) => reader.cancel(r),
  });
}

/** The whole body as text, at most `max` bytes. @throws 413 past it. */
async function cappedText(request: Request, max: number): Promise<string> {
  if (!request.body) return '';
  const reader = limited(request.body, max).getReader();
  const chunks: Uint8Array[] = [];
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch (e) {
      if (e instanceof HttpError) throw errors.tooLarge(`The body is larger than ${max} bytes.`);
      throw e;
    }
    if (step.done) break;
    chunks.push(step.value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/**
 * Reads a JSON body: requires `Content-Type: application/json` (415 otherwise: forces a CORS
 * preflight for cross-site callers, ASVS 4.0.3 13.2.5), caps its size and validates it.
 */
export async function readJson<T>(ctx: APIContext, schema: ZodType<T>): Promise<T> {
  const type = ctx.request.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) throw errors.unsupportedMediaType('Send the body as application/json.');
  const declared = Number(ctx.request.headers.get('content-length') ?? 0);
  if (declared > MAX_JSON_BYTES) throw errors.tooLarge(`The body is larger than ${MAX_JSON_BYTES} bytes.`);
  const text = await cappedText(ctx.request, MAX_JSON_BYTES);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw errors.badRequest('The body is not valid JSON.');
  }
  return parseWith(schema, value);
}

/** Query parameters as a plain object, validated. */
export function readQuery<T>(ctx: APIContext, schema: ZodType<T>): T {
  return parseWith(schema, Object.fromEntries(ctx.url.searchParams));
}

type Handler = (ctx: APIContext) => Promise<Response> | Response;

/** A refused request goes into the activity log as a security event (ASVS 4.0.3 7.1.3, 7.2.2). */
async function logDenied(ctx: APIContext, e: HttpError): Promise<void> {
  const actor = ctx.locals.actor;
  try {
    const { logActivity } = await import('./activity');
    await logActivity({
      action: 'access.denied',
      userId: actor && actor.id !== 'control' ? actor.id : null,
      actor: actor?.email ?? '',
      ip: ctx.clientAddress,
      details: { method: ctx.request.method, path: ctx.url.pathname, message: e.message },
    });
  } catch (err) {
    console.error('[activity] could not record a refused request:', err);
  }
}

/** Wraps an endpoint: HttpError → its status; anything else → 500 with a support id. */
export function endpoint(handler: Handler): APIRoute {
  return async (ctx) => {
    try {
      return await handler(ctx);
    } catch (e) {
      if (e instanceof HttpError) {
        if (e.status === 403) await logDenied(ctx, e);
        return errorResponse(e);
      }
      if (e instanceof z.ZodError) {
        const { message, details } = describeZodError(e);
        return errorResponse(errors.badRequest(message, details));
      }
      const supportId = randomUUID().slice(0, 8);
      console.error(`[api] ${ctx.request.method} ${ctx.url.pathname} failed (support id ${supportId}):`, e);
      return errorResponse(
        new HttpError(500, 'internal', `Something went wrong on our side. Support id: ${supportId}.`, { supportId }),
      );
    }
  };
}

/** Reads a path parameter that must be a UUID; @throws 404 otherwise (an id that cannot exist). */
export function uuidParam(ctx: APIContext, name: string): string {
  const v = ctx.params[name] ?? '';
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v)) throw errors.notFound();
  return v.toLowerCase();
}
