import type { APIRoute } from 'astro';
import { getDatabase } from '../../db/client';
import { json } from '../../server/http';

/** Liveness and readiness: answers once the database is open and migrated. */
export const GET: APIRoute = async () => {
  const db = await getDatabase();
  return json({ ok: true, database: db.kind });
};
