import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';

/**
 * Every migration down to nothing and back up again on the real MariaDB: each `down` must undo
 * its `up`, and the schema afterwards must equal the schema before.
 * Runs on a scratch database so the shared test database keeps its data.
 */
let getSequelize: typeof import('@/db/sequelize').getSequelize;

beforeAll(async () => {
  process.env.MIGRATE_QUIET = '1';
  process.env.DATABASE_NAME = `${process.env.DATABASE_NAME}_scratch`;
  ({ getSequelize } = await import('@/db/sequelize'));
});

async function tables(): Promise<string[]> {
  const rows = await getSequelize().query<{ t: string }>(
    'SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name',
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.t);
}

async function columns(): Promise<string[]> {
  const rows = await getSequelize().query<{ c: string }>(
    "SELECT CONCAT(table_name, '.', column_name, ':', column_type, ':', is_nullable) AS c FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name NOT LIKE 'schema_%' ORDER BY c",
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.c);
}

afterAll(async () => {
  const { closeSequelize } = await import('@/db/sequelize');
  await closeSequelize();
});

describe('migrations', () => {
  it('run up, all the way down, and up again to the same schema', async () => {
    const { migrator } = await import('@/db/migrate');
    await migrator().up();
    const pendingAfterUp = await migrator().pending();
    expect(pendingAfterUp).toEqual([]);
    const before = await columns();
    expect(before.length).toBeGreaterThan(10);
    expect(await tables()).toEqual(expect.arrayContaining(['companies', 'memberships', 'plans', 'sessions', 'users']));

    const executed = (await migrator().executed()).map((m) => m.name);
    await migrator().down({ to: 0 });
    expect((await tables()).filter((t) => !t.startsWith('schema_'))).toEqual([]);
    expect((await migrator().executed()).length).toBe(0);

    await migrator().up();
    expect((await migrator().executed()).map((m) => m.name)).toEqual(executed);
    expect(await columns()).toEqual(before);
  }, 120_000);
});
