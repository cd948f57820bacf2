/** Mail goes over real SMTP to the in-process catcher and lands in the outbox, password resets too. */
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '../../src/db/client';
import { mailOutbox } from '../../src/db/schema';
import { getAuth } from '../../src/server/auth';
import { sendMail } from '../../src/server/mail';
import { createUser } from '../../src/server/services/users';

async function waitForDelivery(id: string) {
  const db = await getDb();
  for (let i = 0; i < 100; i++) {
    const [row] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, id));
    if (row?.receivedAt) return row;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('message never reached the local SMTP server');
}

describe('local mail', () => {
  it('a message makes the SMTP round trip and is filed with its raw source', async () => {
    const id = await sendMail({ to: 'someone@example.test', subject: 'Round trip ✓', text: 'Hello from the test.\nLine two.' });
    const row = await waitForDelivery(id);
    expect(row.status).toBe('sent');
    expect(row.raw).toMatch(/^Message-ID: <.+>/im);
    expect(row.raw).toMatch(/To: someone@example\.test/);
    expect(row.text).toBe('Hello from the test.\nLine two.');
  });

  it('a password reset mail carries a working link for the account', async () => {
    await createUser(null, { email: 'reset.me@example.test', name: 'Reset Me', role: 'analyst', installations: [] }, 'initial passphrase 1');
    const auth = await getAuth();
    await auth.api.requestPasswordReset({ body: { email: 'reset.me@example.test', redirectTo: 'http://localhost:4321/reset-password' } });
    const db = await getDb();
    const [row] = await db.select().from(mailOutbox).where(eq(mailOutbox.toAddress, 'reset.me@example.test'));
    expect(row).toBeDefined();
    const delivered = await waitForDelivery(row!.id);
    expect(delivered.subject).toMatch(/password/i);
    expect(delivered.text).toMatch(/\/api\/auth\/reset-password\/[A-Za-z0-9_-]+\?callbackURL=/);
  });
});
