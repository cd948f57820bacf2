/** Settings edited in the app (thresholds, factors, rates): stored by key, validated on the way in and out. */
import { eq } from 'drizzle-orm';
import type { ZodType } from 'zod';
import { getDb } from '../db/client';
import { appSetting } from '../db/schema';
import { logActivity } from './activity';
import type { Actor } from './authz';

/** The stored value, or the default when none is stored or the stored one no longer validates. */
export async function getSetting<T>(key: string, schema: ZodType<T>, fallback: T): Promise<T & { updatedAt?: string }> {
  const db = await getDb();
  const [row] = await db.select().from(appSetting).where(eq(appSetting.key, key));
  if (!row) return fallback as T & { updatedAt?: string };
  const r = schema.safeParse(row.value);
  return r.success ? ({ ...(r.data as object), updatedAt: row.updatedAt.toISOString() } as T & { updatedAt: string }) : (fallback as T & { updatedAt?: string });
}

export async function putSetting<T>(actor: Actor, key: string, value: T, ip = ''): Promise<void> {
  const db = await getDb();
  await db
    .insert(appSetting)
    .values({ key, value: value as object, updatedBy: actor.id })
    .onConflictDoUpdate({ target: appSetting.key, set: { value: value as object, updatedBy: actor.id, updatedAt: new Date() } });
  await logActivity({ action: 'setting.change', userId: actor.id, actor: actor.email, entityType: 'setting', entityId: key, ip, details: { value } });
}
