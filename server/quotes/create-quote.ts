import 'server-only';
import { models } from '@/db/models';
import { getStudy } from '@/db/queries/studies';
import { getQuote, insertQuote, insertQuoteEvent, nextQuoteNumber, updateQuoteTerms, deleteDraftQuote, type QuoteTermsRow } from '@/db/queries/quotes';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { revokeAllShareLinks } from '@/db/queries/share-links';
import { ConflictError, InvalidInputError, NotFoundError } from '@/server/errors';
import type { NewQuoteInput, UpdateQuoteInput } from '@/server/validation/quote';
import { quoteOptionsOf, quoteStudySnapshotOf } from './options-of-study';
import { actorLabel, type QuoteActor } from './actor';
import { assertValidUntil, totalsOrFieldError } from './validity';
import { isEditable, quoteReference } from './status';

type Terms = Omit<UpdateQuoteInput, 'quoteId'>;

function termsRow(input: Terms, defaultTitle: string): QuoteTermsRow {
  const prices = {
    hardwarePrice: input.hardwarePrice,
    labourPrice: input.labourPrice,
    extrasPrice: input.extrasPrice,
    discountAmount: input.discountAmount,
    taxRatePercent: input.taxRatePercent,
  };
  const totals = totalsOrFieldError(prices);
  return {
    title: input.title ?? defaultTitle,
    customerName: input.customerName,
    customerEmail: input.customerEmail,
    validUntil: input.validUntil,
    notes: input.notes,
    ...prices,
    extrasLabel: input.extrasLabel,
    ...totals,
  };
}

/**
 * A draft quote from one option of a study. The options the customer will see are copied from
 * the study's stored result (never recomputed), so the quote shows what the study showed.
 * Numbering and insert happen under the company row lock: two quotes never share a number.
 */
export async function createQuote(actor: QuoteActor, input: NewQuoteInput, now: Date = new Date()): Promise<{ id: number; number: number }> {
  const study = await getStudy(actor.companyId, input.studyId);
  if (!study) throw new NotFoundError('That study');
  const all = quoteOptionsOf(study);
  const chosen = all.find((o) => o.index === input.optionIndex);
  if (!chosen) throw new InvalidInputError('Please check the highlighted fields.', { optionIndex: [`The study has options 1–${all.length}; choose one of them.`] });
  if (!chosen.closes) {
    throw new InvalidInputError('Please check the highlighted fields.', { optionIndex: [`${chosen.dishName} does not receive this service even in clear sky; quote a larger dish.`] });
  }
  const wanted = new Set(input.shownOptions ?? all.filter((o) => o.closes).map((o) => o.index));
  for (const i of wanted) {
    if (!all.some((o) => o.index === i)) throw new InvalidInputError('Please check the highlighted fields.', { shownOptions: [`Option ${i + 1} is not in this study.`] });
  }
  wanted.add(chosen.index);
  const shown = all.filter((o) => wanted.has(o.index));
  assertValidUntil(input.validUntil, now);
  const terms = termsRow(input, `${study.siteName}: ${chosen.dishName}`);
  const snapshot = quoteStudySnapshotOf(study);

  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const number = await nextQuoteNumber(await lockCompanyRow(actor.companyId, t));
    const id = await insertQuote(
      actor.companyId,
      {
        ...terms,
        number,
        studyId: study.id,
        siteName: study.siteName,
        serviceName: study.serviceName,
        chosenOptionIndex: chosen.index,
        recommendedOptionIndex: study.result.tradeoff.recommendation.smallestMeetingTargetIndex,
        chosenOption: chosen,
        options: shown,
        studySnapshot: snapshot,
        currency: 'USD',
        createdByUserId: actor.user.id,
      },
      t,
    );
    await insertQuoteEvent(
      { companyId: actor.companyId, quoteId: id, kind: 'created', toStatus: 'draft', actorUserId: actor.user.id, actorLabel: actorLabel(actor), detail: { studyId: study.id, option: chosen.index, total: terms.total } },
      t,
    );
    return { id, number };
  });
}

/** New terms for a draft; a quote that was sent stays exactly as the customer saw it. */
export async function updateDraftQuote(actor: QuoteActor, input: UpdateQuoteInput, now: Date = new Date()): Promise<void> {
  assertValidUntil(input.validUntil, now);
  const { sequelize } = models();
  await sequelize.transaction(async (t) => {
    const quote = await getQuote(actor.companyId, input.quoteId, { t, lock: true });
    if (!quote) throw new NotFoundError('That quote');
    if (!isEditable(quote.status)) throw new ConflictError(`${quoteReference(quote.number)} has been sent, so it stays as the customer saw it. Make a new quote from the study to change it.`);
    const terms = termsRow(input, quote.title);
    await updateQuoteTerms(actor.companyId, quote.id, terms, t);
    await insertQuoteEvent({ companyId: actor.companyId, quoteId: quote.id, kind: 'updated', fromStatus: 'draft', toStatus: 'draft', actorUserId: actor.user.id, actorLabel: actorLabel(actor), detail: { total: terms.total } }, t);
  });
}

/** Deletes a draft. A draft has no links (making one sends the quote); any found are revoked all the same. */
export async function deleteQuote(actor: QuoteActor, quoteId: number): Promise<{ number: number }> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const quote = await getQuote(actor.companyId, quoteId, { t, lock: true });
    if (!quote) throw new NotFoundError('That quote');
    if (!isEditable(quote.status)) throw new ConflictError(`${quoteReference(quote.number)} has been sent; it stays on record. It expires on its own after ${quote.validUntil}.`);
    await revokeAllShareLinks(actor.companyId, quote.id, actor.user.id, t);
    await deleteDraftQuote(actor.companyId, quote.id, t);
    return { number: quote.number };
  });
}
