import { desc } from 'drizzle-orm';
import { z } from 'zod';
import { getDb } from '../../db/client';
import { mailOutbox } from '../../db/schema';
import { requirePermission } from '../../server/authz';
import { endpoint, json, readQuery } from '../../server/http';

const querySchema = z.object({ limit: z.coerce.number().int().min(1).max(500).default(100) });

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'outbox:read');
  const { limit } = readQuery(ctx, querySchema);
  const db = await getDb();
  const items = await db
    .select({
      id: mailOutbox.id,
      messageId: mailOutbox.messageId,
      to: mailOutbox.toAddress,
      from: mailOutbox.fromAddress,
      subject: mailOutbox.subject,
      text: mailOutbox.text,
      status: mailOutbox.status,
      error: mailOutbox.error,
      createdAt: mailOutbox.createdAt,
      receivedAt: mailOutbox.receivedAt,
    })
    .from(mailOutbox)
    .orderBy(desc(mailOutbox.createdAt))
    .limit(limit);
  return json({ items });
});
