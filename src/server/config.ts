/** Settings read from the environment, with the defaults a fresh install runs on. */

function port(): number {
  const p = Number(process.env.PORT ?? 4321);
  return Number.isInteger(p) && p > 0 ? p : 4321;
}

/** The address browsers use: BETTER_AUTH_URL, else derived from HOST and PORT. */
export function appBaseUrl(): string {
  const explicit = process.env.PLUMBLINE_URL ?? process.env.BETTER_AUTH_URL;
  if (explicit) return explicit.replace(/\/+$/, '');
  const host = process.env.HOST && !['0.0.0.0', '::', 'true'].includes(process.env.HOST) ? process.env.HOST : 'localhost';
  return `http://${host}:${port()}`;
}

/** Origins allowed to post to the auth routes: the base URL and both loopback spellings. */
export function trustedOrigins(): string[] {
  const p = port();
  const extra = (process.env.PLUMBLINE_TRUSTED_ORIGINS ?? '').split(',').map((s) => s.trim()).filter(Boolean);
  return [...new Set([appBaseUrl(), `http://localhost:${p}`, `http://127.0.0.1:${p}`, ...extra])];
}

/** Demo mode: the demo scenario is loaded into an empty database and its accounts are shown at sign-in. */
export function demoEnabled(): boolean {
  return process.env.PLUMBLINE_DEMO !== '0';
}

/** Scheduled jobs run in this process unless PLUMBLINE_JOBS=0. */
export function jobsEnabled(): boolean {
  return process.env.PLUMBLINE_JOBS !== '0';
}

export const DEMO_PASSWORD = 'plumbline-demo-2026';

/** Upload limit for bill and weather files (bytes); PLUMBLINE_MAX_UPLOAD_MB, default 50 MB. */
export function maxUploadBytes(): number {
  const mb = Number(process.env.PLUMBLINE_MAX_UPLOAD_MB ?? 50);
  return (Number.isFinite(mb) && mb > 0 ? mb : 50) * 1024 * 1024;
}

/** Limit for JSON request bodies (bytes). */
export const MAX_JSON_BYTES = 1024 * 1024;

export function mailFrom(): string {
  return process.env.MAIL_FROM ?? 'Plumbline <no-reply@plumbline.invalid>';
}
