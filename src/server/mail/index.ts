/**
 * Outgoing mail through nodemailer over SMTP. With SMTP_URL unset, an in-process SMTP server
 * (local-smtp.ts) receives every message and files it in the outbox table, so development and
 * tests make a real SMTP round trip and admins read the mail on the Outbox page.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import nodemailer, { type Transporter } from 'nodemailer';
import { getDb } from '../../db/client';
import { mailOutbox } from '../../db/schema';
import { mailFrom } from '../config';
import { ensureLocalSmtp } from './local-smtp';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

let transport: { url: string; t: Transporter } | undefined;

async function transporter(): Promise<Transporter> {
  const url = process.env.SMTP_URL ?? (await ensureLocalSmtp());
  if (!transport || transport.url !== url) {
    const u = new URL(url);
    const local = u.protocol === 'smtp:' && (u.hostname === '127.0.0.1' || u.hostname === 'localhost');
    // The local catcher speaks plain SMTP on loopback; a real server is used as its URL says.
    const t = local ? nodemailer.createTransport({ host: u.hostname, port: Number(u.port), secure: false, ignoreTLS: true }) : nodemailer.createTransport(url);
    transport = { url, t };
  }
  return transport.t;
}

/**
 * Records the message in the outbox and sends it. A failed send is kept with its error (the
 * caller's action has already happened; mail is a notification, not part of the transaction).
 * @returns the outbox row id
 */
export async function sendMail(mail: OutgoingMail): Promise<string> {
  const db = await getDb();
  const from = mailFrom();
  const domain = /@([^>\s]+)/.exec(from)?.[1] ?? 'plumbline.invalid';
  const messageId = `<${randomUUID()}@${domain}>`;
  const [row] = await db
    .insert(mailOutbox)
    .values({ messageId, toAddress: mail.to, fromAddress: from, subject: mail.subject, text: mail.text })
    .returning({ id: mailOutbox.id });
  try {
    const t = await transporter();
    await t.sendMail({ from, to: mail.to, subject: mail.subject, text: mail.text, messageId });
    await db.update(mailOutbox).set({ status: 'sent', sentAt: new Date() }).where(eq(mailOutbox.id, row!.id));
  } catch (e) {
    console.error('[mail] send failed:', (e as Error).message);
    await db
      .update(mailOutbox)
      .set({ status: 'failed', error: (e as Error).message.slice(0, 500) })
      .where(eq(mailOutbox.id, row!.id));
  }
  return row!.id;
}
