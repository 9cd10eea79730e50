import fs from 'node:fs';
import path from 'node:path';

/**
 * Integration tests run against the real MariaDB, mail catcher and payments fake that
 * `npm test` (or `bash docker-local/services.sh test`) started; their settings are in .local/test.env.
 */
export function loadTestEnv(): void {
  if (process.env.DATABASE_HOST) return;
  const file = path.resolve(__dirname, '../../.local/test.env');
  if (!fs.existsSync(file)) {
    throw new Error('Integration tests need the test services: run `npm test`, or `bash docker-local/services.sh test` first.');
  }
  for (const line of fs.readFileSync(file, 'utf8').split('\n')) {
    const m = /^([A-Z0-9_]+)='(.*)'$/.exec(line);
    if (m) process.env[m[1]] = m[2];
  }
}
