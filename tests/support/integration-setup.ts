/**
 * Per test file: a fresh database (PGlite loaded from the migrated template, or a PostgreSQL
 * database cloned from the template database), closed and dropped afterwards.
 */
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, inject } from 'vitest';

const adminUrl = process.env.DATABASE_URL;
let dbName: string | null = null;

beforeAll(async () => {
  const tplDb = inject('pgTemplateDb');
  if (adminUrl && tplDb) {
    dbName = `plumbline_t_${randomBytes(6).toString('hex')}`;
    const admin = new pg.Client({ connectionString: adminUrl });
    await admin.connect();
    await admin.query(`create database ${dbName} template ${tplDb}`);
    await admin.end();
    const u = new URL(adminUrl);
    u.pathname = `/${dbName}`;
    process.env.DATABASE_URL = u.toString();
  } else {
    process.env.PLUMBLINE_PGLITE_TEMPLATE = inject('pgliteTemplate');
  }
});

afterAll(async () => {
  const { closeDatabase } = await import('../../src/db/client');
  const { stopLocalSmtp } = await import('../../src/server/mail/local-smtp');
  await stopLocalSmtp();
  await closeDatabase();
  if (adminUrl && dbName) {
    const admin = new pg.Client({ connectionString: adminUrl });
    await admin.connect();
    await admin.query(`drop database if exists ${dbName} with (force)`);
    await admin.end();
  }
});
