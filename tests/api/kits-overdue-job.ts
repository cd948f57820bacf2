/**
 * Run by tests/api/kits-overdue.test.ts on a stopped data folder (`node --import tsx`): moves the
 * loan given in argv back by the given number of days, as if that much time had passed since it
 * was shipped, then runs the `loan-overdue` job exactly as the scheduler would and prints its
 * result as JSON.
 */
import { eq, sql } from 'drizzle-orm';
import { closeDatabase, getDb } from '../../src/db/client';
import { loan } from '../../src/db/schema';
import { JOBS, runJob } from '../../src/server/jobs';
import { stopLocalSmtp } from '../../src/server/mail/local-smtp';
import { ensureSecret } from '../../src/server/runtime';

const [loanId, days] = process.argv.slice(2);
if (!loanId || !days || !/^\d+$/.test(days)) {
  process.stderr.write('usage: kits-overdue-job.ts <loan id> <days back>\n');
  process.exit(2);
}
ensureSecret();
const db = await getDb();
const moved = await db
  .update(loan)
  .set({ startDate: sql`${loan.startDate} - ${Number(days)}::int`, endDate: sql`${loan.endDate} - ${Number(days)}::int` })
  .where(eq(loan.id, loanId))
  .returning({ start: loan.startDate, end: loan.endDate });
const job = JOBS.find((j) => j.name === 'loan-overdue');
if (!job) throw new Error('no loan-overdue job');
const result = await runJob(job);
process.stdout.write(`${JSON.stringify({ moved: moved[0] ?? null, ...result })}\n`);
await stopLocalSmtp().catch(() => undefined);
await closeDatabase();
