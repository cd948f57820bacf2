/** Who hears about kit loans: the custodians (administrators when there is none), and borrowers. */
import { and, eq, inArray, or, isNull } from 'drizzle-orm';
import { user } from '../../db/schema';
import type { Db, Tx } from '../../db/client';

export interface Person {
  id: string;
  name: string;
  email: string;
}

const active = or(isNull(user.banned), eq(user.banned, false));

/** Kit custodians who may sign in; the administrators when the library has no custodian. */
export async function custodians(db: Db | Tx): Promise<Person[]> {
  const cols = { id: user.id, name: user.name, email: user.email };
  const rows = await db.select(cols).from(user).where(and(eq(user.role, 'kit_custodian'), active));
  if (rows.length > 0) return rows;
  return db.select(cols).from(user).where(and(eq(user.role, 'admin'), active));
}

/** People by id (missing or banned ids are left out). */
export async function peopleById(db: Db | Tx, ids: readonly (string | null)[]): Promise<Person[]> {
  const wanted = [...new Set(ids.filter((x): x is string => !!x))];
  if (wanted.length === 0) return [];
  return db.select({ id: user.id, name: user.name, email: user.email }).from(user).where(and(inArray(user.id, wanted), active));
}

/** Unique by e-mail address, in order. */
export function uniqueRecipients(people: readonly Person[]): Person[] {
  const seen = new Set<string>();
  return people.filter((p) => (seen.has(p.email.toLowerCase()) ? false : (seen.add(p.email.toLowerCase()), true)));
}
