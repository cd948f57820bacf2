/**
 * `plumbline user add --email <address> --name <name> --role <role> [--installations A,B]`: an
 * account created from the command line, e.g. the first administrator of an installation that
 * runs without the demo. The person gets the welcome mail; the command also prints the link
 * (valid one hour), since on a new installation nobody can read the Outbox yet.
 */
import { desc, eq } from 'drizzle-orm';
import { ROLES } from '../../lib/domain';
import { userInputSchema } from '../../lib/schemas/users';
import { parseArgs, withDatabase } from './db-session';

const USAGE = `usage: plumbline user add --email <address> --name <name> --role <${ROLES.join('|')}> [--installations CODE,CODE]`;

export async function userCommand(argv: string[], out: NodeJS.WritableStream, err: NodeJS.WritableStream = process.stderr): Promise<number> {
  const [sub, ...rest] = argv;
  if (sub !== 'add') {
    err.write(`${USAGE}\n`);
    return 2;
  }
  const { options } = parseArgs(rest, []);
  const parsed = userInputSchema.safeParse({
    email: options.email,
    name: options.name,
    role: options.role,
    installations: options.installations ? options.installations.split(',').map((s) => s.trim()).filter(Boolean) : [],
  });
  if (!parsed.success) {
    for (const i of parsed.error.issues) err.write(`${i.path.join('.') || 'input'}: ${i.message}\n`);
    err.write(`${USAGE}\n`);
    return 2;
  }
  return withDatabase(err, async (actor) => {
    const { createUser } = await import('../../server/services/users');
    const { HttpError } = await import('../../server/http');
    const { getDb } = await import('../../db/client');
    const { mailOutbox } = await import('../../db/schema');
    try {
      const { id } = await createUser(actor, parsed.data);
      const db = await getDb();
      const [mail] = await db.select({ text: mailOutbox.text }).from(mailOutbox).where(eq(mailOutbox.toAddress, parsed.data.email)).orderBy(desc(mailOutbox.createdAt)).limit(1);
      const link = mail ? /(https?:\/\/\S+)/.exec(mail.text)?.[1] : undefined;
      out.write(`Created ${parsed.data.role} ${parsed.data.email} (${id}).\n`);
      out.write(link ? `A welcome mail was sent. To choose a password now, open within the hour:\n  ${link}\n` : 'A welcome mail was sent.\n');
      return 0;
    } catch (e) {
      if (e instanceof HttpError) {
        err.write(`${e.message}\n`);
        return 2;
      }
      throw e;
    }
  });
}
