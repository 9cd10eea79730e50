import { asSignedOut, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { signIn } from '@/server/actions/auth';
import { createCompany, createUserWithRole, TEST_PASSWORD } from './support/factories';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
});

describe('sign-in "next" (checked against APP_URL from the environment)', () => {
  it.each(['/\t/evil.example', '/\n/evil', '//evil', '/\\evil', 'https://evil.example', 'javascript:alert(1)'])('ignores %j and goes to the dashboard', async (next) => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD, next })).redirect).toBe('/dashboard');
  });

  it('follows a same-site path with its query', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD, next: '/studies?q=a' })).redirect).toBe('/studies?q=a');
  });
});
