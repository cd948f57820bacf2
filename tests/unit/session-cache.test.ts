/** The in-process memory of verified sessions: expiry, forgetting, and the lookup-in-flight race. */
import { beforeEach, describe, expect, it } from 'vitest';
import { forgetSessions, readSnapshot, sessionCookieValue, SNAPSHOT_SECONDS, snapshotGeneration, storeSnapshot } from '../../src/server/session-cache';
import type { Actor } from '../../src/server/authz';

const actor: Actor = { id: 'u1', email: 'a@example.test', name: 'A', role: 'analyst', installationIds: [], scoped: false };
const T = 1_000_000_000_000;

beforeEach(() => forgetSessions());

describe('session snapshots', () => {
  it('finds the cookie under either name better-auth uses', () => {
    expect(sessionCookieValue(new Headers({ cookie: 'x=1; better-auth.session_token=abc.sig; y=2' }))).toBe('abc.sig');
    expect(sessionCookieValue(new Headers({ cookie: '__Secure-better-auth.session_token=def.sig' }))).toBe('def.sig');
    expect(sessionCookieValue(new Headers({ cookie: 'not-better-auth.session_token=zzz' }))).toBeNull();
    expect(sessionCookieValue(new Headers())).toBeNull();
  });

  it('lives SNAPSHOT_SECONDS at most, and never past the end of the session', () => {
    storeSnapshot('c1', snapshotGeneration(), { actor, sessionId: 's1' }, T + 3_600_000, T);
    expect(readSnapshot('c1', T + SNAPSHOT_SECONDS * 1000 - 1)?.sessionId).toBe('s1');
    expect(readSnapshot('c1', T + SNAPSHOT_SECONDS * 1000)).toBeNull();
    storeSnapshot('c2', snapshotGeneration(), { actor, sessionId: 's2' }, T + 2_000, T);
    expect(readSnapshot('c2', T + 1_999)?.sessionId).toBe('s2');
    expect(readSnapshot('c2', T + 2_000)).toBeNull();
    storeSnapshot('c3', snapshotGeneration(), { actor, sessionId: 's3' }, T - 1, T);
    expect(readSnapshot('c3', T)).toBeNull();
  });

  it('forgets everything at once', () => {
    storeSnapshot('c1', snapshotGeneration(), { actor, sessionId: 's1' }, T + 3_600_000, T);
    forgetSessions();
    expect(readSnapshot('c1', T)).toBeNull();
  });

  it('a lookup that was running while sessions were forgotten does not store what it read', () => {
    const generation = snapshotGeneration(); // the lookup starts
    forgetSessions(); // an account is blocked meanwhile
    storeSnapshot('c1', generation, { actor, sessionId: 's1' }, T + 3_600_000, T); // the lookup ends
    expect(readSnapshot('c1', T)).toBeNull();
  });
});
