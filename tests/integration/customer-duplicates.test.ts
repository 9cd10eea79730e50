import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import * as customerActions from '@/server/actions/customers';
import { createCompany, createUserWithRole, signInAs, suffix, type TestCompany } from './support/factories';

/** A new customer whose name the company already has (case and spacing aside) is caught, and the existing one named. */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
let homeToken: string;
let otherToken: string;

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  homeToken = await signInAs(await createUserWithRole(home.id, 'installer'));
  otherToken = await signInAs(await createUserWithRole(other.id, 'installer'));
});

const countNamed = (companyId: number, name: string) => models().Customer.count({ where: { companyId, name } });

describe('createCustomer and duplicate names', () => {
  it('refuses the same name again, case and spaces aside, naming the existing customer; nothing is added', async () => {
    const name = `Ashgrove Cottage ${suffix()}`;
    asUser(homeToken);
    expect((await callAction(customerActions.createCustomer, { name, email: 'ash@cottage.example' })).state).toMatchObject({ ok: true });
    const again = await callAction(customerActions.createCustomer, { name: `  ${name.toUpperCase().replace(' ', '   ')} ` });
    expect(again.state).toMatchObject({ ok: false, code: 'duplicate_customer' });
    const state = again.state as { error: string; fieldErrors: Record<string, string[]> };
    expect(state.error).toContain(`${name} is already one of your customers (ash@cottage.example, 0 sites`);
    expect(state.fieldErrors.name[0]).toContain(name);
    expect(await models().Customer.count({ where: { companyId: home.id } })).toBe(1);
  });

  it('adds a different customer with the same name when the form says so', async () => {
    const name = `Brookside Dairy ${suffix()}`;
    asUser(homeToken);
    await callAction(customerActions.createCustomer, { name });
    expect((await callAction(customerActions.createCustomer, { name, sameNameOk: 'on' })).state).toMatchObject({ ok: true });
    expect(await countNamed(home.id, name)).toBe(2);
  });

  it('does not look at other companies’ customers', async () => {
    const name = `Copperbeech Lodge ${suffix()}`;
    asUser(homeToken);
    await callAction(customerActions.createCustomer, { name });
    asUser(otherToken);
    expect((await callAction(customerActions.createCustomer, { name })).state).toMatchObject({ ok: true });
  });

  it('lets only one of two quick identical submits through (the company row lock)', async () => {
    const name = `Dovecote Barn ${suffix()}`;
    asUser(homeToken);
    const [a, b] = await Promise.all([callAction(customerActions.createCustomer, { name }), callAction(customerActions.createCustomer, { name })]);
    expect([a.state, b.state].map((s) => (s as { ok: boolean }).ok).sort()).toEqual([false, true]);
    expect(await countNamed(home.id, name)).toBe(1);
  });
});
