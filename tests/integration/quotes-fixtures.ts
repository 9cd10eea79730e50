import { models } from '@/db/models';
import { createQuote } from '@/server/quotes/create-quote';
import { createShareLink } from '@/server/quotes/share';
import { addDays, utcDay } from '@/server/quotes/status';
import type { TestUser } from './support/factories';
import { createStudyWorld, insertTestStudy, type StudyWorld } from './studies-fixtures';

/**
 * Quotes for integration tests, made through the real quote services (not raw rows), on a study
 * computed by the real engine (tests/integration/studies-fixtures.ts). Invented names only.
 */
const worlds = new Map<number, Promise<StudyWorld>>();
export const studyWorldOf = (companyId: number) => {
  if (!worlds.has(companyId)) worlds.set(companyId, createStudyWorld(companyId));
  return worlds.get(companyId)!;
};

export async function testStudy(user: TestUser): Promise<number> {
  return insertTestStudy(user.companyId!, user.id, await studyWorldOf(user.companyId!));
}

export const quoteTerms = (over: Record<string, unknown> = {}) => ({
  customerName: 'Ottoline Marsh',
  customerEmail: 'ottoline@fenwold.example',
  validUntil: addDays(utcDay(), 30),
  hardwarePrice: '189.00',
  labourPrice: '95.00',
  extrasLabel: 'Wall bracket and 20 m of cable',
  extrasPrice: '42.50',
  discountAmount: '10.00',
  taxRatePercent: '8.25',
  notes: 'Fitting on the south gable, scaffold not needed.',
  title: null,
  ...over,
});

const actorOf = (u: TestUser) => ({ companyId: u.companyId!, user: { id: u.id, name: u.name, email: u.email } });

/** A draft quote on option 1 (the 90 cm dish of the test world) of a fresh study. */
export async function draftQuote(user: TestUser, over: Record<string, unknown> = {}): Promise<{ quoteId: number; studyId: number }> {
  const studyId = await testStudy(user);
  const { id } = await createQuote(actorOf(user), { studyId, optionIndex: 1, shownOptions: undefined, ...quoteTerms(over) } as never);
  return { quoteId: id, studyId };
}

/** A sent quote with one open link; returns the raw token, as only the link's URL carries it. */
export async function sentQuote(user: TestUser, over: Record<string, unknown> = {}): Promise<{ quoteId: number; token: string; linkId: number; url: string }> {
  const { quoteId } = await draftQuote(user, over);
  const link = await createShareLink(actorOf(user), quoteId, 30);
  return { quoteId, token: link.url.split('/').pop()!, linkId: link.linkId, url: link.url };
}

export async function quoteRow(quoteId: number) {
  return (await models().Quote.findByPk(quoteId))!;
}
