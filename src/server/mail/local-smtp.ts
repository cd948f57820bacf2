/**
 * The local mail catcher: an SMTP server on the loopback interface (the `smtp-server` package)
 * that files every message it receives in the outbox. Started once per process, on demand.
 */
import { eq } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { getDb } from '../../db/client';
import { mailOutbox } from '../../db/schema';

const KEY = Symbol.for('plumbline.local-smtp');
type Holder = typeof globalThis & { [KEY]?: Promise<{ url: string; close(): Promise<void> }> };
const holder = globalThis as Holder;

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

async function file(raw: Buffer): Promise<void> {
  const parsed = await simpleParser(raw);
  const db = await getDb();
  const messageId = parsed.messageId ?? '';
  const text = raw.toString('utf8');
  const updated = messageId
    ? await db
        .update(mailOutbox)
        .set({ receivedAt: new Date(), raw: text })
        .where(eq(mailOutbox.messageId, messageId))
        .returning({ id: mailOutbox.id })
    : [];
  if (updated.length === 0) {
    const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
    await db.insert(mailOutbox).values({
      messageId: messageId || `<local-${Date.now()}-${Math.random().toString(36).slice(2)}@plumbline.invalid>`,
      toAddress: to,
      fromAddress: parsed.from?.text ?? '',
      subject: parsed.subject ?? '',
      text: parsed.text ?? '',
      status: 'sent',
      receivedAt: new Date(),
      raw: text,
    });
  }
}

function start(): Promise<{ url: string; close(): Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    banner: 'Plumbline local mail catcher',
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        file(Buffer.concat(chunks)).then(
          () => callback(),
          (e: Error) => callback(e),
        );
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(Number(process.env.PLUMBLINE_LOCAL_SMTP_PORT ?? 0), '127.0.0.1', () => {
      const address = server.server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      resolve({
        url: `smtp://127.0.0.1:${port}`,
        close: () => new Promise<void>((r) => server.close(() => r())),
      });
    });
  });
}

/** Starts the local SMTP server if it is not running; returns its smtp:// URL. */
export async function ensureLocalSmtp(): Promise<string> {
  holder[KEY] ??= start();
  return (await holder[KEY]).url;
}

export async function stopLocalSmtp(): Promise<void> {
  const pending = holder[KEY];
  delete holder[KEY];
  if (pending) await (await pending).close();
}
