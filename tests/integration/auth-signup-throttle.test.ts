import { asSignedOut, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, afterEach, beforeEach, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { signUp } from '@/server/actions/auth';
import { THROTTLE_RULES } from '@/server/auth/throttle';
import { signUpRequestedMessage } from '@/server/auth/sign-up';
import { uniqueEmail } from './support/factories';

// Default configuration: TRUST_PROXY unset, so no request has a known IP and the per-IP rule
// cannot apply. Sign-up must still be throttled, by address and by one shared bucket.
afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({ 'x-forwarded-for': '203.0.113.9' }); // ignored: no trusted proxy
});

const form = (email: string) => ({ name: 'Tamsin Vey', companyName: 'Brindlecot Aerials', email, password: 'a-long-enough-pass' });

describe('sign-up throttle when the client IP is unknown', () => {
  // These attempts land in the shared unknown-IP bucket too: take them out again.
  const afterThis: string[] = [];
  afterEach(async () => {
    await models().SignInAttempt.destroy({ where: { kind: 'sign_up', email: afterThis.splice(0) } });
  });

  it('limits attempts per address (taken or not), then says when to come back', async () => {
    const rule = THROTTLE_RULES.sign_up.perEmail ?? { max: 3, windowMinutes: 60 };
    const email = uniqueEmail('founder');
    afterThis.push(email);
    // Every answer within the limit is the same "check your inbox", so counting them tells nothing.
    for (let i = 0; i < rule.max; i++) expect((await callAction(signUp, form(email))).state).toEqual({ ok: true, message: signUpRequestedMessage(email) });
    const out = await callAction(signUp, form(email));
    expect(out.state).toMatchObject({ ok: false, code: 'rate_limited', error: `Too many sign-up attempts for this address. Try again in ${rule.windowMinutes} minutes.` });
  });

  describe('one bucket shared by every request without a known IP', () => {
    const planted: number[] = [];
    afterEach(async () => {
      // The bucket is shared with anyone else using this database: take our rows out again.
      await models().SignInAttempt.destroy({ where: { id: planted.splice(0) } });
    });

    it('is higher than the per-IP limit, and stops new companies once it is full', async () => {
      const rule = THROTTLE_RULES.sign_up.unknownIp ?? { max: 50, windowMinutes: 60 };
      expect(rule.max).toBeGreaterThan(THROTTLE_RULES.sign_up.perIp!.max);
      const { SignInAttempt } = models();
      const since = new Date(Date.now() - rule.windowMinutes * 60_000);
      const already = await SignInAttempt.count({ where: { kind: 'sign_up', ip: null, createdAt: { [Op.gte]: since } } });
      const fill = Math.max(0, rule.max - already - 1);
      const rows = await SignInAttempt.bulkCreate(Array.from({ length: fill }, (_, i) => ({ kind: 'sign_up' as const, email: `bucket-${i}-${Date.now()}@test.example`, ip: null, succeeded: true })));
      planted.push(...rows.map((r) => r.id));

      const last = uniqueEmail('last-in');
      expect((await callAction(signUp, form(last))).state).toEqual({ ok: true, message: signUpRequestedMessage(last) });
      const refused = await callAction(signUp, form(uniqueEmail('one-too-many')));
      expect(refused.state).toMatchObject({ ok: false, code: 'rate_limited', error: expect.stringMatching(/^Too many new accounts right now\. Try again in \d+ minutes?\.$/) });
      planted.push(...(await SignInAttempt.findAll({ where: { kind: 'sign_up', email: [last] } })).map((r) => r.id));
    });
  });
});
