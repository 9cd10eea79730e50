import { asSignedOut, asUser, callAction, revalidatedPaths } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { createQuote, deleteQuote, updateQuote } from '@/server/actions/quotes';
import { createShareLink } from '@/server/actions/share-links';
import { addDays, utcDay } from '@/server/quotes/status';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { draftQuote, quoteRow, quoteTerms, testStudy } from './quotes-fixtures';

let company: TestCompany;
let installer: TestUser;
let sales: TestUser;
let admin: TestUser;
let otherInstaller: TestUser;

beforeAll(async () => {
  company = await createCompany();
  installer = await createUserWithRole(company.id, 'installer');
  sales = await createUserWithRole(company.id, 'sales');
  admin = await createUserWithRole(company.id, 'admin');
  otherInstaller = await createUserWithRole((await createCompany()).id, 'installer');
});
afterAll(closeSequelize);
beforeEach(() => asSignedOut());

describe('createQuote', () => {
  it('makes a numbered draft from a study option with exact totals, snapshots and a timeline event', async () => {
    const studyId = await testStudy(installer);
    asUser(await signInAs(installer));
    const out = await callAction(createQuote, { studyId: String(studyId), optionIndex: '1', ...quoteTerms(), shownOptions: ['0', '1', '2'] });
    expect(out.state?.ok, JSON.stringify(out.state)).toBe(true);
    const { id, number } = (out.state as { data: { id: number; number: number } }).data;
    expect(number).toBeGreaterThan(0);
    const q = await quoteRow(id);
    expect(q.status).toBe('draft');
    expect(q.companyId).toBe(company.id);
    expect(q.createdByUserId).toBe(installer.id);
    // 189 + 95 + 42.50 − 10 = 316.50; tax 8.25 % = 26.11125 → 26.11; total 342.61.
    expect([q.subtotal, q.taxAmount, q.total]).toEqual(['316.50', '26.11', '342.61']);
    expect(q.chosenOptionIndex).toBe(1);
    expect(q.options.map((o) => o.index)).toEqual([0, 1, 2]);
    expect(q.chosenOption.diameterM).toBe(0.9);
    // The snapshot carries the study's figures, not recomputed ones.
    const study = await models().Study.findByPk(studyId);
    const result = (typeof study!.result === 'string' ? JSON.parse(study!.result) : study!.result) as { tradeoff: { options: { outageMinutesPerYear: number }[] } };
    expect(q.chosenOption.outage.outageMinutesPerYear).toBe(result.tradeoff.options[1].outageMinutesPerYear);
    const events = await models().QuoteEvent.findAll({ where: { quoteId: id } });
    expect(events.map((e) => e.kind)).toEqual(['created']);
    expect(revalidatedPaths()).toContain('/quotes');
  });

  it('numbers quotes one after another in the company, even in parallel', async () => {
    const studyId = await testStudy(installer);
    const token = await signInAs(installer);
    asUser(token);
    const outs = await Promise.all([0, 1, 2, 3].map(() => callAction(createQuote, { studyId, optionIndex: 0, ...quoteTerms() })));
    const numbers = outs.map((o) => (o.state as { data: { number: number } }).data.number).sort((a, b) => a - b);
    expect(new Set(numbers).size).toBe(4);
    expect(numbers[3] - numbers[0]).toBe(3);
  });

  it('refuses bad prices, a past validity and an unknown option with field errors, saving nothing', async () => {
    const studyId = await testStudy(installer);
    asUser(await signInAs(installer));
    const before = await models().Quote.count({ where: { companyId: company.id } });
    const bad = await callAction(createQuote, { studyId, optionIndex: 1, ...quoteTerms({ hardwarePrice: '12.345', taxRatePercent: '140' }) });
    expect(bad.state).toMatchObject({ ok: false, fieldErrors: { hardwarePrice: [expect.any(String)], taxRatePercent: [expect.stringContaining('100')] } });
    const discount = await callAction(createQuote, { studyId, optionIndex: 1, ...quoteTerms({ discountAmount: '5000' }) });
    expect(discount.state).toMatchObject({ ok: false, fieldErrors: { discountAmount: [expect.stringContaining('larger than')] } });
    const past = await callAction(createQuote, { studyId, optionIndex: 1, ...quoteTerms({ validUntil: addDays(utcDay(), -1) }) });
    expect(past.state).toMatchObject({ ok: false, fieldErrors: { validUntil: [expect.stringContaining('today or later')] } });
    const option = await callAction(createQuote, { studyId, optionIndex: 9, ...quoteTerms() });
    expect(option.state).toMatchObject({ ok: false, fieldErrors: { optionIndex: [expect.stringContaining('options 1–3')] } });
    expect(await models().Quote.count({ where: { companyId: company.id } })).toBe(before);
  });

  it('is for installers and admins: sales may not, signed-out may not', async () => {
    const studyId = await testStudy(installer);
    asUser(await signInAs(sales));
    expect((await callAction(createQuote, { studyId, optionIndex: 1, ...quoteTerms() })).state).toMatchObject({ ok: false, code: 'forbidden' });
    asSignedOut();
    expect((await callAction(createQuote, { studyId, optionIndex: 1, ...quoteTerms() })).state).toMatchObject({ ok: false, code: 'unauthenticated' });
    asUser(await signInAs(admin));
    expect((await callAction(createQuote, { studyId, optionIndex: 1, ...quoteTerms() })).state?.ok).toBe(true);
  });

  it('answers "not found" for another company’s study', async () => {
    const foreignStudy = await testStudy(otherInstaller);
    asUser(await signInAs(installer));
    expect((await callAction(createQuote, { studyId: foreignStudy, optionIndex: 1, ...quoteTerms() })).state).toMatchObject({ ok: false, code: 'not_found' });
  });
});

describe('updateQuote and deleteQuote', () => {
  it('rewrites a draft’s terms and totals, then refuses once it was sent', async () => {
    const { quoteId } = await draftQuote(installer);
    asUser(await signInAs(installer));
    const out = await callAction(updateQuote, { quoteId, ...quoteTerms({ hardwarePrice: '200', extrasPrice: '', discountAmount: '', taxRatePercent: '' }) });
    expect(out.state?.ok, JSON.stringify(out.state)).toBe(true);
    const q = await quoteRow(quoteId);
    expect([q.hardwarePrice, q.extrasPrice, q.discountAmount, q.taxRatePercent, q.total]).toEqual(['200.00', '0.00', '0.00', '0.000', '295.00']);

    asUser(await signInAs(sales));
    expect((await callAction(createShareLink, { quoteId })).state?.ok).toBe(true);
    asUser(await signInAs(installer));
    const late = await callAction(updateQuote, { quoteId, ...quoteTerms({ hardwarePrice: '1' }) });
    expect(late.state).toMatchObject({ ok: false, code: 'conflict' });
    expect((await quoteRow(quoteId)).hardwarePrice).toBe('200.00');
    expect((await callAction(deleteQuote, { quoteId })).state).toMatchObject({ ok: false, code: 'conflict' });
  });

  it('deletes a draft; another company’s quote is "not found" and untouched', async () => {
    const { quoteId } = await draftQuote(installer);
    const foreign = await draftQuote(otherInstaller);
    asUser(await signInAs(installer));
    expect((await callAction(deleteQuote, { quoteId: foreign.quoteId })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await callAction(updateQuote, { quoteId: foreign.quoteId, ...quoteTerms({ hardwarePrice: '1' }) })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await quoteRow(foreign.quoteId)).hardwarePrice).toBe('189.00');
    expect((await callAction(deleteQuote, { quoteId })).state?.ok).toBe(true);
    expect(await models().Quote.findByPk(quoteId)).toBeNull();
  });
});
