/**
 * Every request: start-up (once), the session → Astro.locals.actor, sign-in required outside the
 * public pages, and the security headers.
 */
import { defineMiddleware } from 'astro:middleware';
import { getAuth, SESSION_ABSOLUTE_SECONDS } from './server/auth';
import { loadActor } from './server/actor';
import { errorResponse, errors, HttpError } from './server/http';
import { ensureRuntime } from './server/runtime';
import { securityHeaders } from './server/security-headers';
import { CONTROL_HEADER, controlActor } from './server/control';
import { forgetSessions, readSnapshot, sessionCookieValue, snapshotGeneration, storeSnapshot } from './server/session-cache';
import { MAX_JSON_BYTES, trustedOrigins } from './server/config';

const PUBLIC_PAGES = new Set(['/sign-in', '/forgot-password', '/reset-password']);
const PUBLIC_PREFIXES = ['/api/auth/', '/_astro/', '/fonts/'];
const PUBLIC_FILES = new Set(['/api/health', '/favicon.svg', '/robots.txt']);

function isPublic(path: string): boolean {
  return PUBLIC_PAGES.has(path) || PUBLIC_FILES.has(path) || PUBLIC_PREFIXES.some((p) => path.startsWith(p));
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery guard (OWASP ASVS 4.0.3 4.2.2, 13.2.3: Origin check): a request that
 * changes something and comes from a browser must come from one of our origins — the configured
 * base URL and trusted origins, or the host the request was sent to.
 */
function crossSite(request: Request): boolean {
  if (SAFE_METHODS.has(request.method)) return false;
  const origin = request.headers.get('origin');
  if (!origin) {
    // Browsers always send Origin on such requests; a missing one with a cross-site fetch
    // marker is refused, scripts without either are judged by their session and content type.
    const site = request.headers.get('sec-fetch-site');
    return site !== null && site !== 'same-origin' && site !== 'none';
  }
  if (trustedOrigins().includes(origin)) return false;
  const host = request.headers.get('host');
  try {
    return !host || new URL(origin).host !== host;
  } catch {
    return true;
  }
}

/** Routes that take a multipart upload; they cap its size themselves (src/server/upload.ts). */
const UPLOAD_ROUTES = [/^\/api\/imports$/, /^\/api\/weather\/stations\/[^/]+\/observations$/, /^\/api\/walkthroughs\/[^/]+\/photos$/];
/** Sign-in, sign-up and password bodies are small; the auth library reads them whole. */
const AUTH_BODY_BYTES = 64 * 1024;

/**
 * A body larger than its route takes is refused before anything reads it (ASVS 4.0.3 12.1.1, 13.1.3):
 * JSON bodies up to MAX_JSON_BYTES (readJson also counts a body sent without a length), auth
 * bodies up to 64 KB and only with a declared length.
 */
function bodyTooLarge(request: Request, path: string): HttpError | null {
  if (SAFE_METHODS.has(request.method) || UPLOAD_ROUTES.some((r) => r.test(path))) return null;
  const header = request.headers.get('content-length');
  const declared = header === null ? null : Number(header);
  const auth = path.startsWith('/api/auth/');
  if (auth && declared === null && request.body) return new HttpError(411, 'length_required', 'Send the request with a Content-Length.');
  const max = auth ? AUTH_BODY_BYTES : MAX_JSON_BYTES;
  if (declared !== null && declared > max) return errors.tooLarge(`The body is larger than ${max} bytes.`);
  return null;
}

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** A plain page for a refused or missing page (the API answers JSON instead). */
function errorPage(status: number, message: string): Response {
  const title = status === 403 ? 'Not allowed' : status === 404 ? 'Not found' : 'Something went wrong';
  const body = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${title} · Plumbline</title></head><body style="font-family:system-ui,sans-serif;max-width:40rem;margin:4rem auto;padding:0 1rem;color:#17202c"><h1>${title}</h1><p>${escapeHtml(message)}</p><p><a href="/">Back to the region board</a></p></body></html>`;
  return new Response(body, { status, headers: { 'content-type': 'text/html; charset=utf-8' } });
}

export const onRequest = defineMiddleware(async (ctx, next) => {
  ctx.locals.actor = null;
  ctx.locals.sessionId = null;
  if (ctx.isPrerendered) return next();

  try {
    await ensureRuntime();
  } catch (e) {
    console.error('[start-up] failed:', e);
    return new Response('Plumbline could not start: see the server log.', { status: 503 });
  }

  const path = ctx.url.pathname;
  if (crossSite(ctx.request)) {
    const refusal = errors.forbidden('Cross-site requests are refused: send the request from Plumbline itself.');
    return securityHeaders(path.startsWith('/api/') ? errorResponse(refusal) : errorPage(403, refusal.message));
  }
  const oversized = path.startsWith('/api/') ? bodyTooLarge(ctx.request, path) : null;
  if (oversized) return securityHeaders(errorResponse(oversized));
  const reading = SAFE_METHODS.has(ctx.request.method);
  const control = ctx.request.headers.has(CONTROL_HEADER) ? controlActor(path, ctx.request.headers, ctx.clientAddress) : null;
  if (control) ctx.locals.actor = control;
  else if (!path.startsWith('/api/auth/') && !path.startsWith('/_astro/')) {
    const cookie = sessionCookieValue(ctx.request.headers);
    const snapshot = cookie && reading ? readSnapshot(cookie) : null;
    if (snapshot) {
      ctx.locals.actor = snapshot.actor;
      ctx.locals.sessionId = snapshot.sessionId;
    } else if (cookie) {
      const generation = snapshotGeneration();
      const auth = await getAuth();
      const session = await auth.api.getSession({ headers: ctx.request.headers }).catch(() => null);
      if (session) {
        const created = new Date(session.session.createdAt).getTime();
        const ends = Math.min(created + SESSION_ABSOLUTE_SECONDS * 1000, new Date(session.session.expiresAt).getTime());
        if (Date.now() < ends && !session.user.banned) {
          ctx.locals.actor = await loadActor(session.user);
          ctx.locals.sessionId = session.session.id;
          if (ctx.locals.actor) storeSnapshot(cookie, generation, { actor: ctx.locals.actor, sessionId: session.session.id }, ends);
        }
      }
    }
  }

  if (!ctx.locals.actor && !isPublic(path)) {
    if (path.startsWith('/api/')) return securityHeaders(errorResponse(errors.unauthorized()));
    const nextPath = path + ctx.url.search;
    return securityHeaders(ctx.redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`, 303));
  }

  try {
    const response = await next();
    // Sign-out, password changes and the account administration end or change sessions.
    if (!reading && ((path.startsWith('/api/auth/') && !path.startsWith('/api/auth/sign-in/')) || path.startsWith('/api/users'))) forgetSessions();
    return securityHeaders(response);
  } catch (e) {
    if (e instanceof HttpError) {
      if (path.startsWith('/api/')) return securityHeaders(errorResponse(e));
      return securityHeaders(errorPage(e.status, e.message));
    }
    throw e;
  }
});
