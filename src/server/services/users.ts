/**
 * Accounts: admins create them (no public sign-up), set roles and installation assignments, and
 * block them. A new account gets a mail with a link to choose its password.
 */
import { forgetSessions } from '../session-cache';
import { randomBytes } from 'node:crypto';
import { asc, eq, inArray } from 'drizzle-orm';
import type { Role } from '../../lib/domain';
import type { UserInput, UserPatch } from '../../lib/schemas/users';
import { getDb, type Tx } from '../../db/client';
import { installation, session, user, userInstallation } from '../../db/schema';
import { logActivity } from '../activity';
import { getAuth } from '../auth';
import { appBaseUrl } from '../config';
import { errors } from '../http';
import { MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH } from '../passwords';
import type { Actor } from '../authz';

export interface UserRow {
  id: string;
  email: string;
  name: string;
  role: string | null;
  banned: boolean;
  installations: string[];
  createdAt: string;
}

export async function listUsers(): Promise<UserRow[]> {
  const db = await getDb();
  const users = await db.select().from(user).orderBy(asc(user.email));
  const links = await db
    .select({ userId: userInstallation.userId, code: installation.code })
    .from(userInstallation)
    .innerJoin(installation, eq(installation.id, userInstallation.installationId))
    .orderBy(asc(installation.code));
  const byUser = new Map<string, string[]>();
  for (const l of links) byUser.set(l.userId, [...(byUser.get(l.userId) ?? []), l.code]);
  return users.map((u) => ({
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    banned: !!u.banned,
    installations: byUser.get(u.id) ?? [],
    createdAt: u.createdAt.toISOString(),
  }));
}

async function installationIds(tx: Tx, codes: string[]): Promise<string[]> {
  if (codes.length === 0) return [];
  const rows = await tx.select({ id: installation.id, code: installation.code }).from(installation).where(inArray(installation.code, codes));
  const missing = codes.filter((c) => !rows.some((r) => r.code === c));
  if (missing.length) throw errors.badRequest(`installations: unknown code ${missing.join(', ')}`, [{ field: 'installations', message: `unknown: ${missing.join(', ')}` }]);
  return rows.map((r) => r.id);
}

async function setAssignments(tx: Tx, userId: string, codes: string[]): Promise<void> {
  const ids = await installationIds(tx, codes);
  await tx.delete(userInstallation).where(eq(userInstallation.userId, userId));
  if (ids.length) await tx.insert(userInstallation).values(ids.map((installationId) => ({ userId, installationId })));
}

/**
 * Creates an account with the given role and installations.
 * @param password when omitted, a random one is set and the person is mailed a link to choose theirs.
 */
export async function createUser(actor: Actor | null, input: UserInput, password?: string, ip = ''): Promise<{ id: string }> {
  // better-auth's admin API does not apply the password policy, so it is applied here.
  if (password !== undefined && (password.length < MIN_PASSWORD_LENGTH || password.length > MAX_PASSWORD_LENGTH))
    throw errors.badRequest(`password: use ${MIN_PASSWORD_LENGTH} to ${MAX_PASSWORD_LENGTH} characters`, [{ field: 'password', message: `use ${MIN_PASSWORD_LENGTH} to ${MAX_PASSWORD_LENGTH} characters` }]);
  const db = await getDb();
  const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, input.email));
  if (existing) throw errors.conflict(`An account for ${input.email} already exists.`, [{ field: 'email', message: 'already in use' }]);
  const auth = await getAuth();
  const created = await auth.api.createUser({
    body: { email: input.email, name: input.name, role: input.role as 'admin', password: password ?? randomBytes(24).toString('base64url') },
  });
  const id = created.user.id;
  await db.transaction((tx) => setAssignments(tx, id, input.installations));
  await logActivity({ action: 'user.create', userId: actor?.id ?? null, actor: actor?.email ?? 'system', entityType: 'user', entityId: id, ip, details: { email: input.email, role: input.role, installations: input.installations } });
  if (!password) {
    await auth.api.requestPasswordReset({ body: { email: input.email, redirectTo: `${appBaseUrl()}/reset-password?welcome=1` } });
  }
  return { id };
}

export async function updateUser(actor: Actor, id: string, patch: UserPatch, ip = ''): Promise<void> {
  const db = await getDb();
  const [current] = await db.select().from(user).where(eq(user.id, id));
  if (!current) throw errors.notFound('No such account.');
  if (id === actor.id && (patch.role && patch.role !== 'admin' || patch.banned)) {
    throw errors.conflict('You cannot remove your own administrator role or block yourself.');
  }
  await db.transaction(async (tx) => {
    const set: Partial<typeof user.$inferInsert> = { updatedAt: new Date() };
    if (patch.name !== undefined) set.name = patch.name;
    if (patch.role !== undefined) set.role = patch.role;
    if (patch.banned !== undefined) set.banned = patch.banned;
    await tx.update(user).set(set).where(eq(user.id, id));
    if (patch.installations !== undefined) await setAssignments(tx, id, patch.installations);
    // A changed role, blocked account or new scope ends the person's sessions (ASVS 5.0 7.4.2).
    if (patch.banned || (patch.role && patch.role !== current.role) || patch.installations !== undefined) {
      await tx.delete(session).where(eq(session.userId, id));
    }
  });
  forgetSessions();
  if (patch.role && patch.role !== current.role)
    await logActivity({ action: 'user.role-change', userId: actor.id, actor: actor.email, entityType: 'user', entityId: id, ip, details: { email: current.email, from: current.role, to: patch.role as Role } });
  if (patch.installations !== undefined)
    await logActivity({ action: 'user.assignment-change', userId: actor.id, actor: actor.email, entityType: 'user', entityId: id, ip, details: { email: current.email, installations: patch.installations } });
  if (patch.banned !== undefined)
    await logActivity({ action: patch.banned ? 'user.block' : 'user.unblock', userId: actor.id, actor: actor.email, entityType: 'user', entityId: id, ip, details: { email: current.email } });
}
