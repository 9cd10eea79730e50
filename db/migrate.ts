import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface } from 'sequelize';
import { getSequelize, closeSequelize } from './sequelize';

/**
 * Schema migrations (db/migrations, recorded in `schema_migrations`) and demo seeders
 * (db/seeders, recorded in `schema_seeds` so the demo scenario is seeded once).
 * CLI: tsx db/migrate.ts up | down [--to 0] | status | seed
 */
function makeUmzug(folder: 'migrations' | 'seeders') {
  const sequelize = getSequelize();
  return new Umzug<QueryInterface>({
    migrations: {
      glob: ['*.ts', { cwd: path.join(__dirname, folder), ignore: ['*.d.ts'] }],
      // import() rather than umzug's require, so the same files load under tsx and vitest alike.
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => (await import(file!)).up({ context }),
        down: async () => (await import(file!)).down({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: folder === 'migrations' ? 'schema_migrations' : 'schema_seeds' }),
    logger: process.env.MIGRATE_QUIET ? undefined : console,
  });
}

export const migrator = () => makeUmzug('migrations');
export const seeder = () => makeUmzug('seeders');

async function main(): Promise<void> {
  const [command = 'up', ...rest] = process.argv.slice(2);
  try {
    if (command === 'up') await migrator().up();
    else if (command === 'down') await migrator().down(rest.includes('--all') ? { to: 0 } : undefined);
    else if (command === 'status') {
      const m = migrator();
      console.log('executed:', (await m.executed()).map((x) => x.name));
      console.log('pending:', (await m.pending()).map((x) => x.name));
    } else if (command === 'seed') await seeder().up();
    else throw new Error(`unknown command "${command}" (use up, down, down --all, status, seed)`);
  } finally {
    await closeSequelize();
  }
}

if (require.main === module) {
  main().catch((error) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
