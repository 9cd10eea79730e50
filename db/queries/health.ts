import { getSequelize } from '../sequelize';

/** One round trip to MariaDB. The reason is a short category, never connection details or secrets. */
export async function checkDatabase(): Promise<{ ok: true } | { ok: false; reason: string }> {
  try {
    await getSequelize().query('SELECT 1', { raw: true });
    return { ok: true };
  } catch (error) {
    const name = (error as { name?: string }).name ?? 'Error';
    const reason = /ConnectionRefused|ECONNREFUSED/i.test(String((error as Error).message) + name)
      ? 'connection refused'
      : /Timeout|acquire/i.test(name + String((error as Error).message))
        ? 'timed out'
        : name.replace(/^Sequelize/, '');
    return { ok: false, reason };
  }
}
