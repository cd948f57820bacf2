/** The activity log: who did what, when — security events, imports, exports, role changes. */
import { activityLog } from '../db/schema';
import type { Db, Tx } from '../db/client';
import { getDb } from '../db/client';

export interface ActivityEntry {
  action: string;
  userId?: string | null;
  actor?: string;
  entityType?: string;
  entityId?: string;
  installationId?: string | null;
  ip?: string;
  details?: Record<string, unknown>;
}

/** Strips control characters so a log line cannot be forged (ASVS 4.0.3 7.3.1). */
function clean(s: string | undefined): string {
  // eslint-disable-next-line no-control-regex
  return (s ?? '').replace(/[\u0000-\u001f\u007f]/g, ' ').slice(0, 500);
}

export async function logActivity(entry: ActivityEntry, db?: Db | Tx): Promise<void> {
  const target = db ?? (await getDb());
  await target.insert(activityLog).values({
    action: clean(entry.action),
    userId: entry.userId ?? null,
    actor: clean(entry.actor),
    entityType: clean(entry.entityType),
    entityId: clean(entry.entityId),
    installationId: entry.installationId ?? null,
    ip: clean(entry.ip),
    details: entry.details ?? {},
  });
}
