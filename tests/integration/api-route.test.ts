import { apiRequest, asSignedOut, asUser, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { closeSequelize } from '@/db/sequelize';
import { apiRoute } from '@/server/api/route';
import { ConflictError, RateLimitedError } from '@/server/errors';
import { GET as getMe } from '@/app/api/v1/me/route';
import { GET as getTeam } from '@/app/api/v1/team/route';
import { createCompany, createStaffUser, createUserWithRole, signInAs } from './support/factories';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
});

const noParams = { params: Promise.resolve({}) };
const echo = apiRoute({ permission: 'study.write', schema: z.object({ name: z.string().min(2), count: z.coerce.number().int().positive() }) }, async ({ input, ctx }) => ({ input, companyId: ctx.companyId }));

describe('apiRoute', () => {
  it('401 without a session, 403 for a role without the permission, JSON bodies with a code', async () => {
    const res = await echo(apiRequest('/x', { method: 'POST', json: { name: 'ok', count: 1 } }), noParams);
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: 'unauthenticated', message: 'Please sign in.' } });
    const company = await createCompany();
    asUser(await signInAs(await createUserWithRole(company.id, 'sales')));
    const denied = await echo(apiRequest('/x', { method: 'POST', json: { name: 'ok', count: 1 } }), noParams);
    expect(denied.status).toBe(403);
    expect((await denied.json()).error.code).toBe('forbidden');
  });

  it('validates the JSON body with the schema (422 with field errors) and passes the parsed input', async () => {
    const company = await createCompany();
    asUser(await signInAs(await createUserWithRole(company.id, 'installer')));
    const bad = await echo(apiRequest('/x', { method: 'POST', json: { name: 'a', count: -1 } }), noParams);
    expect(bad.status).toBe(422);
    expect((await bad.json()).error).toMatchObject({ code: 'invalid_input', fieldErrors: { name: expect.any(Array), count: expect.any(Array) } });
    const notJson = await echo(new Request(`${process.env.APP_URL ?? 'http://localhost:3100'}/x`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: apiRequest('/').headers.get('cookie')! }, body: '{oops' }), noParams);
    expect(notJson.status).toBe(422);
    const good = await echo(apiRequest('/x', { method: 'POST', json: { name: 'ok', count: '3' } }), noParams);
    expect(good.status).toBe(200);
    expect(await good.json()).toEqual({ input: { name: 'ok', count: 3 }, companyId: company.id });
    expect(good.headers.get('cache-control')).toBe('no-store');
  });

  it('refuses a write whose Origin is another site (cookie-riding), before anything else', async () => {
    const company = await createCompany();
    asUser(await signInAs(await createUserWithRole(company.id, 'installer')));
    const res = await echo(apiRequest('/x', { method: 'POST', json: { name: 'ok', count: 1 }, headers: { origin: 'https://evil.example' } }), noParams);
    expect(res.status).toBe(403);
    const same = await echo(apiRequest('/x', { method: 'POST', json: { name: 'ok', count: 1 }, headers: { origin: new URL(process.env.APP_URL ?? 'http://localhost:3100').origin } }), noParams);
    expect(same.status).toBe(200);
  });

  it('maps AppErrors to their status (with Retry-After for 429) and hides unexpected errors as 500', async () => {
    const company = await createCompany();
    asUser(await signInAs(await createUserWithRole(company.id, 'admin')));
    const conflict = apiRoute({ permission: 'team.manage' }, async () => {
      throw new ConflictError('Already done.');
    });
    expect((await conflict(apiRequest('/x'), noParams)).status).toBe(409);
    const limited = apiRoute({ permission: 'signed-in' }, async () => {
      throw new RateLimitedError(125);
    });
    const l = await limited(apiRequest('/x'), noParams);
    expect(l.status).toBe(429);
    expect(l.headers.get('retry-after')).toBe('125');
    expect((await l.json()).error.message).toBe('Too many attempts. Try again in 3 minutes.');
    const boom = apiRoute({ permission: 'signed-in' }, async () => {
      throw new Error('secret detail: password=hunter2');
    });
    const b = await boom(apiRequest('/x'), noParams);
    expect(b.status).toBe(500);
    expect(JSON.stringify(await b.json())).not.toContain('hunter2');
  });
});

describe('account routes', () => {
  it('/api/v1/me tells the role and its permissions; staff have no company', async () => {
    const company = await createCompany();
    const sales = await createUserWithRole(company.id, 'sales');
    asUser(await signInAs(sales));
    const me = await (await getMe(apiRequest('/api/v1/me'), noParams)).json();
    expect(me).toMatchObject({ role: 'sales', company: { id: company.id }, user: { email: sales.email } });
    expect(me.permissions).toContain('quote.share');
    expect(me.permissions).not.toContain('team.manage');
    asUser(await signInAs(await createStaffUser()));
    expect(await (await getMe(apiRequest('/api/v1/me'), noParams)).json()).toMatchObject({ role: 'staff', company: null });
  });

  it('/api/v1/team lists only this company’s people, with seats', async () => {
    const a = await createCompany();
    const b = await createCompany();
    const admin = await createUserWithRole(a.id, 'admin');
    await createUserWithRole(a.id, 'installer');
    const outsider = await createUserWithRole(b.id, 'installer');
    asUser(await signInAs(admin));
    const team = await (await getTeam(apiRequest('/api/v1/team'), noParams)).json();
    expect(team.members).toHaveLength(2);
    expect(JSON.stringify(team)).not.toContain(outsider.email);
    expect(team.seats).toMatchObject({ used: 2, limit: 5 });
  });
});
