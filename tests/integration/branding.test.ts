import { asSignedOut, asUser, callAction } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { removeLogo, uploadLogo } from '@/server/actions/branding';
import { getCompanyLogo, getCompanyLogoInfo } from '@/db/queries/branding';
import { createCompany, createUserWithRole, signInAs } from './support/factories';

// An 8 × 4 px PNG (made for this test).
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAgAAAAECAIAAAA8r+mnAAAAEklEQVR4nGNgYPjPwMDAxMAAAAcgAgE1VKoPAAAAAElFTkSuQmCC', 'base64');
const file = (bytes: Buffer, name = 'logo.png', type = 'image/png') => new File([new Uint8Array(bytes)], name, { type });

afterAll(closeSequelize);
beforeEach(() => asSignedOut());

describe('company logo for quotes', () => {
  it('an admin on a branding plan stores a PNG as sent, and removes it', async () => {
    const company = await createCompany({ planCode: 'crew' });
    asUser(await signInAs(await createUserWithRole(company.id, 'admin')));
    const out = await callAction(uploadLogo, { logo: file(PNG) });
    expect(out.state).toMatchObject({ ok: true, message: expect.stringContaining('8 × 4 px') });
    const logo = await getCompanyLogo(company.id);
    expect(logo?.mime).toBe('image/png');
    expect(logo?.data.equals(PNG)).toBe(true);
    expect(await getCompanyLogoInfo(company.id)).toMatchObject({ width: 8, height: 4, bytes: PNG.length });
    expect((await callAction(removeLogo, {})).state?.ok).toBe(true);
    expect(await getCompanyLogo(company.id)).toBeNull();
  });

  it('judges the file by its bytes: a renamed text file, an empty file and a 201 KiB file are refused', async () => {
    const company = await createCompany({ planCode: 'crew' });
    asUser(await signInAs(await createUserWithRole(company.id, 'admin')));
    const fake = await callAction(uploadLogo, { logo: file(Buffer.from('<svg/> pretending'), 'logo.png') });
    expect(fake.state).toMatchObject({ ok: false, fieldErrors: { logo: [expect.stringContaining('Only PNG and JPEG')] } });
    expect((await callAction(uploadLogo, { logo: file(Buffer.alloc(0)) })).state).toMatchObject({ ok: false, fieldErrors: { logo: [expect.any(String)] } });
    const big = Buffer.concat([PNG, Buffer.alloc(201 * 1024)]);
    expect((await callAction(uploadLogo, { logo: file(big) })).state).toMatchObject({ ok: false, fieldErrors: { logo: [expect.stringContaining('200 KiB')] } });
    expect(await getCompanyLogo(company.id)).toBeNull();
  });

  it('is refused, naming the plan feature, when the plan has no quote branding; and is admin-only', async () => {
    const bench = await createCompany({ planCode: 'bench' });
    asUser(await signInAs(await createUserWithRole(bench.id, 'admin')));
    expect((await callAction(uploadLogo, { logo: file(PNG) })).state).toMatchObject({ ok: false, code: 'plan_limit', error: expect.stringContaining('Quote branding') });
    expect(await getCompanyLogo(bench.id)).toBeNull();

    const crew = await createCompany({ planCode: 'crew' });
    asUser(await signInAs(await createUserWithRole(crew.id, 'installer')));
    expect((await callAction(uploadLogo, { logo: file(PNG) })).state).toMatchObject({ ok: false, code: 'forbidden' });
  });
});
