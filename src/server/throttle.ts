/**
 * Per-account sign-in throttling (ASVS 4.0.3 2.2.1 allows at most 100 failures per hour per
 * account): after FAILURE_LIMIT failures within WINDOW_MINUTES the account is locked for
 * LOCK_MINUTES, whatever address the attempts come from. Counters live in the database so a
 * restart does not reset them.
 */
import { eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { signInThrottle } from '../db/schema';

export const FAILURE_LIMIT = 10;
export const WINDOW_MINUTES = 15;
export const LOCK_MINUTES = 15;

const key = (email: string) => `account:${email.trim().toLowerCase()}`;

export const accountThrottle = {
  /** When the account is locked, the time the lock ends; otherwise null. */
  async check(email: string, now = new Date()): Promise<Date | null> {
    const db = await getDb();
    const [row] = await db.select().from(signInThrottle).where(eq(signInThrottle.key, key(email)));
    return row?.lockedUntil && row.lockedUntil > now ? row.lockedUntil : null;
  },

  async fail(email: string, now = new Date()): Promise<void> {
    const db = await getDb();
    await db.transaction(async (tx) => {
      const [row] = await tx.select().from(signInThrottle).where(eq(signInThrottle.key, key(email))).for('update');
      const windowOpen = row && now.getTime() - row.windowStart.getTime() < WINDOW_MINUTES * 60_000;
      const failures = windowOpen ? row.failures + 1 : 1;
      const lockedUntil = failures >= FAILURE_LIMIT ? new Date(now.getTime() + LOCK_MINUTES * 60_000) : null;
      const values = { failures, windowStart: windowOpen ? row.windowStart : now, lockedUntil };
      if (row) await tx.update(signInThrottle).set(values).where(eq(signInThrottle.key, key(email)));
      else await tx.insert(signInThrottle).values({ key: key(email), ...values });
    });
  },

  async reset(email: string): Promise<void> {
    const db = await getDb();
    await db.delete(signInThrottle).where(eq(signInThrottle.key, key(email)));
  },
};
