/**
 * Per-account sign-in throttling (ASVS 4.0.3 2.2.1: at most 100 failures per hour per account):
 * after 10 failures the account is locked for 15 minutes, even for the right password, and the
 * failures are in the activity log.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '../../src/db/client';
import { activityLog } from '../../src/db/schema';
import { getAuth } from '../../src/server/auth';
import { createUser } from '../../src/server/services/users';
import { FAILURE_LIMIT } from '../../src/server/throttle';

async function attempt(email: string, password: string): Promise<number> {
  const auth = await getAuth();
  const res = await auth.handler(
    new Request('http://localhost:4321/api/auth/sign-in/email', {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: 'http://localhost:4321', 'x-plumbline-client-ip': `10.0.0.${Math.floor(Math.random() * 200)}` },
      body: JSON.stringify({ email, password }),
    }),
  );
  return res.status;
}

describe('per-account throttling', () => {
  it('locks the account after repeated failures from any address', async () => {
    const email = 'locked.out@example.test';
    await createUser(null, { email, name: 'Locked Out', role: 'analyst', installations: [] }, 'the right passphrase');
    expect(await attempt(email, 'the right passphrase')).toBe(200);
    for (let i = 0; i < FAILURE_LIMIT; i++) expect(await attempt(email, `wrong ${i}`)).toBe(401);
    expect(await attempt(email, 'the right passphrase')).toBe(429);
    const db = await getDb();
    const failures = await db.select().from(activityLog).where(eq(activityLog.action, 'auth.sign-in-failed'));
    expect(failures.filter((f) => f.actor === email)).toHaveLength(FAILURE_LIMIT);
  });

  it('passwords shorter than 12 characters are refused', async () => {
    await expect(createUser(null, { email: 'short@example.test', name: 'Short Pw', role: 'analyst', installations: [] }, 'elevenchars')).rejects.toThrow();
  });
});
