import { inRequest, callAction } from './support/next-request';
import { afterAll, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { inviteMember } from '@/server/actions/team';
import { seatsInUse } from '@/server/billing/limits';
import { createCompanyWithSeats, createUserWithRole, signInAs, uniqueEmail } from './support/factories';

afterAll(closeSequelize);

describe('seat limit under concurrency', () => {
  it('20 invitations sent at once against 5 seats (1 taken by the admin) yield exactly 4', async () => {
    const company = await createCompanyWithSeats(5);
    const admin = await createUserWithRole(company.id, 'admin');
    const token = await signInAs(admin);
    const emails = Array.from({ length: 20 }, (_, i) => uniqueEmail(`rush${i}`));

    const outcomes = await Promise.all(emails.map((email) => inRequest(token, () => callAction(inviteMember, { email, role: 'sales' }))));

    const codes = outcomes.map((o) => (o.state?.ok ? 'ok' : o.state?.code));
    expect(codes.filter((c) => c === 'ok')).toHaveLength(4);
    expect(codes.filter((c) => c === 'plan_limit')).toHaveLength(16);
    expect(await models().Invitation.count({ where: { companyId: company.id } })).toBe(4);
    expect(await seatsInUse(company.id)).toBe(5);
  });

  it('two admins inviting at once share the same limit', async () => {
    const company = await createCompanyWithSeats(6);
    const a = await signInAs(await createUserWithRole(company.id, 'admin'));
    const b = await signInAs(await createUserWithRole(company.id, 'admin'));
    const outcomes = await Promise.all(
      Array.from({ length: 12 }, (_, i) => inRequest(i % 2 ? a : b, () => callAction(inviteMember, { email: uniqueEmail(`pair${i}`), role: 'installer' }))),
    );
    expect(outcomes.filter((o) => o.state?.ok)).toHaveLength(4);
    expect(await seatsInUse(company.id)).toBe(6);
  });
});
