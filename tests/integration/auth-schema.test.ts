/**
 * better-auth's tables are written by hand (its schema CLI needs Node 22). This guards them: every
 * field better-auth expects, with our admin plugin and database rate limiting, exists in the
 * Drizzle schema under the same property name, and required fields are NOT NULL.
 */
import { getAuthTables } from 'better-auth/db';
import { admin } from 'better-auth/plugins';
import { getTableColumns, type Table } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import * as schema from '../../src/db/schema';

const tables: Record<string, Table> = {
  user: schema.user,
  session: schema.session,
  account: schema.account,
  verification: schema.verification,
  rateLimit: schema.rateLimit,
};

describe('better-auth tables', () => {
  const expected = getAuthTables({ plugins: [admin()], rateLimit: { enabled: true, storage: 'database' } });
  it.each(Object.entries(expected))('%s has every field better-auth uses', (name, def) => {
    const table = tables[name];
    expect(table, `no Drizzle table for ${name}`).toBeDefined();
    const columns = getTableColumns(table!);
    for (const [field, attr] of Object.entries(def.fields)) {
      const col = columns[field];
      expect(col, `${name}.${field} missing`).toBeDefined();
      if (attr.required) expect(col!.notNull, `${name}.${field} should be NOT NULL`).toBe(true);
    }
  });
});
