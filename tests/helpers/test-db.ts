import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { inject } from 'vitest';

/** Clones the migrated template into a new database for one test file; returns its URL. */
export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const port = inject('pgPort');
  const template = inject('templateDb');
  const name = `seepwise_test_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${port}/postgres` });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name} TEMPLATE ${template}`);
  await admin.end();
  return {
    url: `postgres://app@127.0.0.1:${port}/${name}`,
    async drop() {
      const c = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${port}/postgres` });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await c.end();
    },
  };
}
