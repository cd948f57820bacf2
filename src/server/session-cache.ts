/**
 * A short-lived, in-process memory of the sessions better-auth has already verified, so that
 * reading requests (GET, HEAD) do not each cost two database round trips.
 *
 * - Only reads use it: every request that changes something verifies its session in the database.
 * - Entries live SNAPSHOT_SECONDS at most and never past the session's own expiry.
 * - Any change to accounts or sessions made through this process (sign-out, password reset,
 *   role, installation assignment, disabling an account, revoking sessions) forgets everything,
 *   at once; a generation counter keeps a lookup that was in flight during such a change from
 *   storing what it read.
 * - With several instances on one PostgreSQL server, a change made on another instance reaches
 *   this one's reads within SNAPSHOT_SECONDS (its writes at once). See docs/decisions/0007.
 *
 * The key is the raw session cookie value (token and signature): an entry exists only for a value
 * better-auth has verified, so a forged cookie never matches one.
 */
import type { Actor } from './authz';

export const SNAPSHOT_SECONDS = 15;
const MAX_ENTRIES = 10_000;

export interface SessionSnapshot {
  actor: Actor;
  sessionId: string;
  /** Epoch ms after which the snapshot is not used: min(loaded + SNAPSHOT_SECONDS, absolute session end). */
  until: number;
}

const KEY = Symbol.for('plumbline.session-cache');
interface State {
  entries: Map<string, SessionSnapshot>;
  generation: number;
}
type Holder = typeof globalThis & { [KEY]?: State };
const state: State = ((globalThis as Holder)[KEY] ??= { entries: new Map(), generation: 0 });

/** better-auth's session cookie (plain, or `__Secure-` prefixed over HTTPS). */
const COOKIE = /(?:^|;\s*)(?:__Secure-)?better-auth\.session_token=([^;]+)/;

export function sessionCookieValue(headers: Headers): string | null {
  const m = COOKIE.exec(headers.get('cookie') ?? '');
  return m?.[1] ?? null;
}

export function readSnapshot(cookie: string, now = Date.now()): SessionSnapshot | null {
  const hit = state.entries.get(cookie);
  if (!hit) return null;
  if (hit.until <= now) {
    state.entries.delete(cookie);
    return null;
  }
  return hit;
}

/** The generation to pass back to `storeSnapshot`: read it before the database lookup starts. */
export function snapshotGeneration(): number {
  return state.generation;
}

export function storeSnapshot(cookie: string, generation: number, snapshot: Omit<SessionSnapshot, 'until'>, sessionEnds: number, now = Date.now()): void {
  if (generation !== state.generation) return;
  const until = Math.min(now + SNAPSHOT_SECONDS * 1000, sessionEnds);
  if (until <= now) return;
  if (state.entries.size >= MAX_ENTRIES) state.entries.clear();
  state.entries.set(cookie, { ...snapshot, until });
}

/** Forget every snapshot (after any change to accounts, roles, assignments or sessions). */
export function forgetSessions(): void {
  state.generation++;
  state.entries.clear();
}

export function snapshotCount(): number {
  return state.entries.size;
}
