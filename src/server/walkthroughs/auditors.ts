/** Field auditors of an installation: who may be given a walkthrough there, and their notice by mail. */
import { and, asc, eq, or, isNull } from 'drizzle-orm';
import type { Db, Tx } from '../../db/client';
import { user, userInstallation } from '../../db/schema';
import { formatDate } from '../../lib/format';
import { appBaseUrl } from '../config';
import { errors } from '../http';
import { sendMail } from '../mail';

/** Auditors assigned to the installation, by name. */
export async function auditorsOf(db: Db | Tx, installationId: string): Promise<{ id: string; name: string; email: string }[]> {
  return db
    .select({ id: user.id, name: user.name, email: user.email })
    .from(userInstallation)
    .innerJoin(user, eq(user.id, userInstallation.userId))
    .where(and(eq(userInstallation.installationId, installationId), eq(user.role, 'auditor'), or(isNull(user.banned), eq(user.banned, false))))
    .orderBy(asc(user.name));
}

/** @throws 422 naming the field when the account is not an auditor assigned to the installation. */
export async function checkAuditor(db: Db | Tx, auditorId: string, installationId: string, code: string): Promise<void> {
  const ok = (await auditorsOf(db, installationId)).some((a) => a.id === auditorId);
  if (!ok) throw errors.unprocessable(`Choose an auditor assigned to ${code}.`, [{ field: 'auditorId', message: `not an auditor assigned to ${code}` }]);
}

export async function notifyAuditor(db: Db | Tx, auditorId: string, w: { id: string; title: string; plannedOn: string; building: string; by: string }): Promise<void> {
  const [a] = await db.select({ email: user.email, name: user.name }).from(user).where(eq(user.id, auditorId));
  if (!a) return;
  await sendMail({
    to: a.email,
    subject: `Walkthrough on ${formatDate(w.plannedOn)}: ${w.building}`,
    text:
      `Hello ${a.name},\n\n${w.by} planned a walkthrough for you: ${w.title}, building ${w.building}, on ${formatDate(w.plannedOn)}.\n\n` +
      `The field form, the instruments to bring and why: ${appBaseUrl()}/walkthroughs/${w.id}\n`,
  });
}
