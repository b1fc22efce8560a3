// Two instances starting at once on a new database: the advisory lock lets one migrate while the
// other waits, and both come up on the same, complete schema.
import { afterAll, describe, expect, it } from 'vitest';
import { runMigrations } from '../../server/db/migrate';
import { MIGRATIONS } from '../../server/db/migrations';
import { createSequelize } from '../../server/db/sequelize';
import { databaseUrl, dropDatabase, ensureDatabase } from '../../scripts/pg.mjs';

const DB = `quiltline_migrate_together_${process.pid}`;

afterAll(() => dropDatabase(DB));

describe('migrations at start-up', () => {
  it('apply once when two instances start together on an empty database', { timeout: 120_000 }, async () => {
    ensureDatabase(DB);
    const url = databaseUrl(DB);
    const a = createSequelize(url);
    const b = createSequelize(url);
    try {
      const [first, second] = await Promise.all([runMigrations(a, url), runMigrations(b, url)]);
      // Every migration applied exactly once, by whichever instance took the lock first.
      expect([...first, ...second].sort()).toEqual(MIGRATIONS.map((m) => m.name).sort());
      expect(Math.min(first.length, second.length)).toBe(0);
      const [rows] = await a.query('SELECT count(*)::int AS n FROM schema_migrations');
      expect((rows as Array<{ n: number }>)[0].n).toBe(MIGRATIONS.length);
    } finally {
      await a.close();
      await b.close();
    }
  });
});
