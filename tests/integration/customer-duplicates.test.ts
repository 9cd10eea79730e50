import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import * as customerActions from '@/server/actions/customers';
import * as studyActions from '@/server/actions/studies';
import { createCompany, createUserWithRole, signInAs, suffix, type TestCompany } from './support/factories';
import { countRows, createStudyWorld, type StudyWorld } from './studies-fixtures';

/** A new customer whose name the company already has (case and spacing aside) is caught, and the existing one named. */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
let homeToken: string;
let otherToken: string;
let studyHome: TestCompany;
let studyToken: string;
let world: StudyWorld;

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  homeToken = await signInAs(await createUserWithRole(home.id, 'installer'));
  otherToken = await signInAs(await createUserWithRole(other.id, 'installer'));
  // Its own company: the tests above count every customer of `home`.
  studyHome = await createCompany({ planCode: 'fleet' });
  studyToken = await signInAs(await createUserWithRole(studyHome.id, 'installer'));
  world = await createStudyWorld(studyHome.id);
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

describe('the study form’s new customer follows the same rule', () => {
  // Invented customer and site; the site is typed in with the study, as the form does for a new customer.
  const studyWithNewCustomer = (newCustomerName: string, extra: Record<string, string> = {}) => ({
    customerMode: 'new',
    newCustomerName,
    siteMode: 'new',
    siteName: 'Orchard shed',
    latDeg: '47.2',
    lonDeg: '2.6',
    altitudeM: '150',
    serviceProfileId: String(world.serviceId),
    climateProfileId: String(world.climateId),
    dishIds: world.dishIds.join(','),
    targetAvailabilityPercent: '99.9',
    ...extra,
  });

  it('refuses a new customer named like an existing one (case and spaces aside), naming it on the customer name; nothing is saved', async () => {
    const name = `Elderflower Mill ${suffix()}`;
    asUser(studyToken);
    expect((await callAction(customerActions.createCustomer, { name, email: 'mill@elder.example' })).state).toMatchObject({ ok: true });
    const before = await Promise.all(['customers', 'sites', 'studies'].map((t) => countRows(t, studyHome.id)));
    const out = await callAction(studyActions.createStudy, studyWithNewCustomer(` ${name.toLowerCase().replace(' ', '  ')}`));
    expect(out.state).toMatchObject({ ok: false, code: 'duplicate_customer' });
    const state = out.state as { error: string; fieldErrors: Record<string, string[]> };
    expect(state.error).toContain(`${name} is already one of your customers (mill@elder.example, 0 sites`);
    expect(state.fieldErrors.newCustomerName[0]).toContain(name);
    expect(await Promise.all(['customers', 'sites', 'studies'].map((t) => countRows(t, studyHome.id)))).toEqual(before);
  });

  it('adds a different customer with the same name with the study when the form says so', async () => {
    const name = `Foxglove Croft ${suffix()}`;
    asUser(studyToken);
    await callAction(customerActions.createCustomer, { name });
    expect((await callAction(studyActions.createStudy, studyWithNewCustomer(name, { sameNameOk: 'on' }))).state).toMatchObject({ ok: true });
    expect(await countNamed(studyHome.id, name)).toBe(2);
  });

  it('the Customers form then refuses the name the study form added', async () => {
    const name = `Gorse Hill Stables ${suffix()}`;
    asUser(studyToken);
    expect((await callAction(studyActions.createStudy, studyWithNewCustomer(name))).state).toMatchObject({ ok: true });
    expect((await callAction(customerActions.createCustomer, { name: name.toUpperCase() })).state).toMatchObject({ ok: false, code: 'duplicate_customer' });
    expect(await countNamed(studyHome.id, name)).toBe(1);
  });

  it('lets only one of two quick identical study submits add the customer (the company row lock)', async () => {
    const name = `Hawthorn Quay ${suffix()}`;
    asUser(studyToken);
    const [a, b] = await Promise.all([callAction(studyActions.createStudy, studyWithNewCustomer(name)), callAction(studyActions.createStudy, studyWithNewCustomer(name))]);
    expect([a.state, b.state].map((s) => (s as { ok: boolean }).ok).sort()).toEqual([false, true]);
    expect([a.state, b.state].find((s) => !(s as { ok: boolean }).ok)).toMatchObject({ code: 'duplicate_customer' });
    expect(await countNamed(studyHome.id, name)).toBe(1);
  });
});
