import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

/**
 * The health route against a MariaDB server of its own (so stopping it cannot disturb other
 * tests): 200 while it runs, 503 with a JSON error once it is stopped, and 200 again after a
 * restart — through the same Sequelize pool, without restarting the app.
 */
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'fadeledger-health-'));
const sock = path.join(dir, 'sock');
const port = 3390 + Math.floor(Math.random() * 9);
const datadir = path.join(dir, 'data');

function ping(): boolean {
  try {
    execFileSync('mariadb-admin', ['--no-defaults', `--socket=${sock}`, '-uroot', 'ping'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

async function startServer(): Promise<void> {
  const child = spawn('/usr/sbin/mariadbd', ['--no-defaults', `--user=${os.userInfo().username}`, `--datadir=${datadir}`, `--socket=${sock}`, `--pid-file=${dir}/pid`, '--bind-address=127.0.0.1', `--port=${port}`, `--log-error=${dir}/err.log`, '--skip-name-resolve'], { detached: true, stdio: 'ignore' });
  child.unref();
  for (let i = 0; i < 100 && !ping(); i++) await new Promise((r) => setTimeout(r, 100));
  if (!ping()) throw new Error('test MariaDB did not start: ' + fs.readFileSync(`${dir}/err.log`, 'utf8'));
}

function stopServer(): void {
  execFileSync('mariadb-admin', ['--no-defaults', `--socket=${sock}`, '-uroot', 'shutdown']);
}

let GET: () => Promise<Response>;

beforeAll(async () => {
  execFileSync('mariadb-install-db', ['--no-defaults', `--user=${os.userInfo().username}`, `--datadir=${datadir}`, '--auth-root-authentication-method=normal', '--skip-test-db'], { stdio: 'ignore' });
  await startServer();
  execFileSync('mariadb', ['--no-defaults', `--socket=${sock}`, '-uroot', '-e', "CREATE DATABASE health_check; CREATE USER 'hc'@'127.0.0.1' IDENTIFIED BY 'hc-pass'; GRANT ALL ON health_check.* TO 'hc'@'127.0.0.1';"]);
  Object.assign(process.env, { DATABASE_HOST: '127.0.0.1', DATABASE_PORT: String(port), DATABASE_NAME: 'health_check', DATABASE_USER: 'hc', DATABASE_PASSWORD: 'hc-pass' });
  ({ GET } = await import('@/app/api/health/route'));
}, 60_000);

afterAll(async () => {
  const { closeSequelize } = await import('@/db/sequelize');
  await closeSequelize().catch(() => undefined);
  if (ping()) stopServer();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('GET /api/health', () => {
  it('answers 200 { db: "ok" } while the database runs', async () => {
    const res = await GET();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ db: 'ok' });
  });

  it('answers 503 with a JSON error once the database stops, then recovers without a restart', async () => {
    stopServer();
    for (let i = 0; i < 50 && ping(); i++) await new Promise((r) => setTimeout(r, 100));
    const down = await GET();
    expect(down.status).toBe(503);
    const body = await down.json();
    expect(body.db).toBe('unavailable');
    expect(body.error).toMatch(/^database unreachable: /);
    // The error names no secret.
    expect(JSON.stringify(body)).not.toContain('hc-pass');

    await startServer();
    let status = 0;
    for (let i = 0; i < 20 && status !== 200; i++) {
      status = (await GET()).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    expect(status).toBe(200);
  }, 60_000);
});
