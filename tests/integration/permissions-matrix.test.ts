import { inRequest } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { PERMISSIONS } from '@/server/auth/permissions';
import { buildWorld, classify, isNotFound, MATRIX_ROLES, rolesFor, type CrossCompanyCase, type MatrixCase, type MatrixWorld } from './support/action-matrix';
import { signInAs } from './support/factories';

/**
 * Every server action and route handler × every role (rows from tests/integration/matrix/*.ts),
 * plus every by-id row of another company answering 404.
 */
type MatrixModule = { cases?: MatrixCase[]; crossCompany?: CrossCompanyCase[] };
const loaded = await Promise.all(Object.entries(import.meta.glob<MatrixModule>('./matrix/*.ts')).map(async ([file, load]) => ({ file, mod: await load() })));
const CASES = loaded.flatMap(({ mod }) => mod.cases ?? []);
const CROSS = loaded.flatMap(({ mod }) => mod.crossCompany ?? []);

let world: MatrixWorld;
beforeAll(async () => {
  world = await buildWorld();
});
afterAll(closeSequelize);

describe('the registry', () => {
  it('has unique names, and each row’s allowed roles agree with the permission map', () => {
    const names = CASES.map((c) => c.name);
    expect(names.length).toBeGreaterThan(0);
    expect(new Set(names).size).toBe(names.length);
    for (const c of CASES) expect([...c.allow].sort(), c.name).toEqual(rolesFor(c.access).sort());
  });

  it('the permission map names only known roles', () => {
    for (const [permission, roles] of Object.entries(PERMISSIONS)) for (const r of roles) expect(['admin', 'installer', 'sales', 'staff'], permission).toContain(r);
  });

  it('covers every exported server action and every route handler in the app', async () => {
    const actionModules = import.meta.glob<Record<string, unknown>>(['/server/actions/*.ts', '!/server/actions/safe-action.ts']);
    const routeModules = import.meta.glob<Record<string, unknown>>('/app/**/route.ts');
    const expected: string[] = [];
    for (const [path, load] of Object.entries(actionModules)) {
      const file = path.replace('/server/actions/', '').replace(/\.ts$/, '');
      for (const [name, value] of Object.entries(await load())) if (typeof value === 'function') expected.push(`action ${file}#${name}`);
    }
    for (const [path, load] of Object.entries(routeModules)) {
      const pattern = path.replace(/^\/app/, '').replace(/\/route\.ts$/, '').replace(/\/\([^)]+\)/g, '') || '/';
      for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE']) if (typeof (await load())[method] === 'function') expected.push(`${method} ${pattern}`);
    }
    const registered = new Set(CASES.map((c) => c.name));
    const missing = expected.filter((e) => !registered.has(e)).sort();
    expect(missing, `add these rows to a file in tests/integration/matrix/ (see support/action-matrix.ts)`).toEqual([]);
  });
});

describe.each(CASES.map((c) => [c.name, c] as const))('%s', (_name, c) => {
  it.each(MATRIX_ROLES.map((r) => [r, c.allow.includes(r) ? 'allowed' : 'denied'] as const))('as %s: %s', async (role, expected) => {
    const prepared = c.prepare ? await c.prepare(world, role) : undefined;
    const token = role === 'signed-out' ? null : await signInAs(world.users[role]);
    const result = await inRequest(token, () => c.run(world, prepared as never, role));
    const { verdict, detail } = await classify(result);
    expect(`${verdict} (${detail})`).toMatch(new RegExp(`^${expected} `));
  });
});

describe.each(CROSS.map((c) => [c.name, c] as const))('another company’s row: %s', (_name, c) => {
  it('answers 404 and leaves the row alone', async () => {
    const prepared = c.prepare ? await c.prepare(world) : undefined;
    const token = await signInAs(world.users[c.as ?? 'admin']);
    const result = await inRequest(token, () => c.run(world, prepared as never));
    const { ok, detail } = await isNotFound(result);
    expect(ok, detail).toBe(true);
    if (c.unchanged) await c.unchanged(world, prepared as never);
  });
});
