import { Sequelize } from 'sequelize';
import { getEnv } from '../server/env';

/**
 * The one Sequelize instance, configured from the environment. Created on first use so that
 * importing a model never opens a connection (next build, unit tests).
 *
 * Stored on globalThis because Next.js dev reloads modules: without it every edit would leak a pool.
 */
const holder = globalThis as unknown as { __fadeledgerSequelize?: Sequelize };

export function getSequelize(): Sequelize {
  if (!holder.__fadeledgerSequelize) {
    const env = getEnv();
    holder.__fadeledgerSequelize = new Sequelize(env.DATABASE_NAME, env.DATABASE_USER, env.DATABASE_PASSWORD, {
      dialect: 'mariadb',
      host: env.DATABASE_HOST,
      port: env.DATABASE_PORT,
      logging: false,
      define: { underscored: true },
      dialectOptions: {
        connectTimeout: 3000,
        // Money and coordinates stay exact strings; decimal.js takes them from there. Sequelize
        // turns supportBigNumbers on, which makes the connector return a whole DECIMAL (189.00)
        // as the number 189 but 189.50 as a string: off, every DECIMAL is a string.
        supportBigNumbers: false,
        decimalAsNumber: false,
        bigIntAsNumber: true,
        insertIdAsNumber: true,
      },
      timezone: '+00:00',
      pool: {
        max: env.DATABASE_POOL_MAX,
        min: 0,
        idle: 10_000,
        acquire: 5_000,
        // A connection that died with a database restart is validated out of the pool and
        // replaced on the next acquire, so the app recovers without a restart.
        evict: 5_000,
      },
      retry: { max: 2 },
    });
  }
  return holder.__fadeledgerSequelize;
}

export async function closeSequelize(): Promise<void> {
  const s = holder.__fadeledgerSequelize;
  holder.__fadeledgerSequelize = undefined;
  if (s) await s.close();
}
