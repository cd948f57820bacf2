import { desc, eq, and, type SQL } from 'drizzle-orm';
import { z } from 'zod';
import { getDb } from '../../db/client';
import { activityLog } from '../../db/schema';
import { requirePermission } from '../../server/authz';
import { endpoint, json, readQuery } from '../../server/http';

const querySchema = z.object({
  limit: z.coerce.number().int().min(1).max(1000).default(200),
  action: z.string().trim().max(60).optional(),
});

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'activity:read');
  const q = readQuery(ctx, querySchema);
  const db = await getDb();
  const where: SQL[] = [];
  if (q.action) where.push(eq(activityLog.action, q.action));
  const items = await db.select().from(activityLog).where(and(...where)).orderBy(desc(activityLog.id)).limit(q.limit);
  return json({ items });
});
