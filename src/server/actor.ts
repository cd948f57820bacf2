/** Turns a better-auth session user into the Actor the authorization module works with. */
import { eq } from 'drizzle-orm';
import { roleSchema } from '../lib/domain';
import { getDb } from '../db/client';
import { userInstallation } from '../db/schema';
import { SCOPED_ROLES, type Actor } from './authz';

export async function loadActor(user: { id: string; email: string; name: string; role?: string | null }): Promise<Actor | null> {
  const role = roleSchema.safeParse(user.role);
  if (!role.success) return null; // an account without a known role gets no access
  const scoped = SCOPED_ROLES.includes(role.data);
  let installationIds: string[] = [];
  if (scoped) {
    const db = await getDb();
    const rows = await db
      .select({ id: userInstallation.installationId })
      .from(userInstallation)
      .where(eq(userInstallation.userId, user.id));
    installationIds = rows.map((r) => r.id);
  }
  return { id: user.id, email: user.email, name: user.name, role: role.data, installationIds, scoped };
}

/** Where each role starts after signing in. */
export function landingPath(actor: Actor): string {
  switch (actor.role) {
    case 'admin':
    case 'regional_manager':
      return '/';
    case 'analyst':
      return '/baselines';
    case 'installation_staff':
      return '/installations';
    case 'auditor':
      return '/walkthroughs';
    case 'kit_custodian':
      return '/kits';
  }
}
