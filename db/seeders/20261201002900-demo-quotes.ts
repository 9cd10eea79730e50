import { randomBytes } from 'node:crypto';
import type { QueryInterface, Transaction } from 'sequelize';
import { models } from '../models';
import { DEMO_COMPANIES, DEMO_USERS } from '../demo/accounts';
import { DEMO_CUSTOMERS } from '../demo/studies';
import { DEMO_QUOTES } from '../demo/quotes';
import { demoLogoPng } from '../demo/quote-logo';
import { hashToken } from '../../server/auth/tokens';
import { linkKeyFrom, sealLinkToken } from '../../server/quotes/link-token-seal';
import { quoteOptionsOf, quoteStudySnapshotOf } from '../../server/quotes/options-of-study';
import { quoteTotals } from '../../server/quotes/totals';
import { addDays, utcDay } from '../../server/quotes/status';
import type { QuoteStatus } from '../../server/quotes/snapshot';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '../../server/studies/snapshot';

type Ctx = { context: QueryInterface };

const DAY_MS = 86_400_000;
const json = <T>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;

/**
 * Demo quotes for Quillfeather Dish & Signal, one in every status (db/demo/quotes.ts), on the
 * demo studies; plus an invented logo. Runs after the demo studies seeder (20261201002000) and
 * skips, saying so, when those studies are not there. Only pure modules are imported: seeders run
 * under tsx, where the 'server-only' marker would refuse to load.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  const { Company, Study, User, Quote, QuoteEvent, ShareLink } = models();
  const company = await Company.findOne({ where: { name: DEMO_COMPANIES[0].name }, order: [['id', 'DESC']] });
  if (!company) {
    console.log('demo quotes: skipped — the demo company is missing (run the account seeder first).');
    return;
  }
  const studies = await Study.findAll({ where: { companyId: company.id }, order: [['id', 'ASC']] });
  if (studies.length === 0) {
    console.log('demo quotes: skipped — no demo studies yet (the studies seeder 20261201002000 makes them).');
    return;
  }
  const email = (role: string) => DEMO_USERS.find((u) => u.role === role && u.company === 'quillfeather')!.email;
  const [installer, sales] = await Promise.all([User.findOne({ where: { email: email('installer') } }), User.findOne({ where: { email: email('sales') } })]);
  const label = (u: { name: string; email: string } | null) => (u ? `${u.name} <${u.email}>` : null);
  const openLinks: string[] = [];

  await qi.sequelize.transaction(async (t: Transaction) => {
    await qi.sequelize.query('UPDATE companies SET logo_mime = :mime, logo_data = :data, logo_width = 160, logo_height = 80, logo_updated_at = NOW() WHERE id = :id', {
      replacements: { mime: 'image/png', data: demoLogoPng(), id: company.id },
      transaction: t,
    });
    let number = Number((await Quote.max('number', { where: { companyId: company.id }, transaction: t })) ?? 0);
    for (const d of DEMO_QUOTES) {
      const study = studies.find((s) => s.title === d.study);
      if (!study) {
        console.log(`demo quotes: no study titled "${d.study}"; that quote is left out.`);
        continue;
      }
      const forQuote = { id: study.id, title: study.title, revision: study.revision, inputs: json<StudyInputsSnapshot>(study.inputs), result: json<StudyResultSnapshot>(study.result) };
      const options = quoteOptionsOf(forQuote);
      const rec = forQuote.result.tradeoff.recommendation;
      const chosen = options.find((o) => o.index === rec.smallestMeetingTargetIndex && o.closes) ?? options.find((o) => o.closes);
      if (!chosen) continue;
      const shown = options.filter((o) => o.closes);
      const created = new Date(Date.now() - d.daysAgo * DAY_MS);
      const sentAt = new Date(created.getTime() + 2 * 3600_000);
      const viewedAt = new Date(sentAt.getTime() + 20 * 3600_000);
      const decidedAt = new Date(viewedAt.getTime() + 30 * 3600_000);
      const validUntil = addDays(utcDay(created), 30);
      const prices = {
        hardwarePrice: chosen.hardwarePrice,
        labourPrice: chosen.labourPrice,
        extrasPrice: d.extras?.price ?? '0.00',
        discountAmount: d.discount,
        taxRatePercent: d.tax,
      };
      const totals = quoteTotals(prices);
      const status = d.status as QuoteStatus;
      const customer = DEMO_CUSTOMERS.find((c) => c.name === study.customerName);
      const wasSent = status !== 'draft';
      const wasViewed = ['viewed', 'accepted', 'declined'].includes(status) || ('views' in d && d.views > 0);
      const decided = status === 'accepted' || status === 'declined';
      number += 1;
      const quote = await Quote.create(
        {
          companyId: company.id,
          number,
          studyId: study.id,
          status,
          title: `${study.siteName}: ${chosen.dishName}`,
          customerName: study.customerName,
          customerEmail: customer?.email ?? null,
          siteName: study.siteName,
          serviceName: study.serviceName,
          chosenOptionIndex: chosen.index,
          recommendedOptionIndex: rec.smallestMeetingTargetIndex,
          chosenOption: chosen,
          options: shown,
          studySnapshot: quoteStudySnapshotOf(forQuote),
          currency: 'USD',
          ...prices,
          extrasLabel: d.extras?.label ?? null,
          ...totals,
          validUntil,
          notes: d.notes,
          sentAt: wasSent ? sentAt : null,
          firstViewedAt: wasViewed ? viewedAt : null,
          decidedAt: decided ? decidedAt : null,
          decidedByName: decided && 'decidedBy' in d ? d.decidedBy : null,
          decisionComment: decided && 'comment' in d ? d.comment : null,
          decisionIp: null,
          decisionUserAgent: null,
          decisionLinkId: null,
          createdByUserId: installer?.id ?? null,
          sentByUserId: wasSent ? (sales?.id ?? null) : null,
          createdAt: created,
          updatedAt: decided ? decidedAt : created,
        },
        { transaction: t },
      );
      const event = (kind: string, at: Date, extra: Record<string, unknown> = {}) =>
        QuoteEvent.create({ companyId: company.id, quoteId: quote.id, kind: kind as never, fromStatus: null, toStatus: null, actorUserId: null, actorLabel: null, detail: null, ip: null, ...extra, createdAt: at }, { transaction: t });
      await event('created', created, { toStatus: 'draft', actorUserId: installer?.id ?? null, actorLabel: label(installer) });
      if (!wasSent) continue;
      const token = randomBytes(32).toString('base64url');
      const expiresAt = status === 'expired' ? new Date(Date.now() - 5 * DAY_MS) : new Date(sentAt.getTime() + 30 * DAY_MS);
      const link = await ShareLink.create(
        {
          companyId: company.id,
          quoteId: quote.id,
          tokenHash: hashToken(token),
          // Sealed like the app's own links so the demo team can copy them (no key: not copyable).
          tokenSealed: process.env.SHARE_LINK_KEY ? sealLinkToken(token, hashToken(token), linkKeyFrom(process.env.SHARE_LINK_KEY)) : null,
          expiresAt,
          revokedAt: null,
          revokedByUserId: null,
          viewCount: 'views' in d ? d.views : 0,
          lastViewedAt: wasViewed ? viewedAt : null,
          createdByUserId: sales?.id ?? null,
          createdAt: sentAt,
          updatedAt: sentAt,
        },
        { transaction: t },
      );
      if (expiresAt.getTime() > Date.now()) openLinks.push(`${status.padEnd(9)} ${study.customerName}: /share/${token}`);
      await event('link_created', sentAt, { actorUserId: sales?.id ?? null, actorLabel: label(sales), detail: { linkId: link.id, via: 'link' } });
      await event('sent', sentAt, { fromStatus: 'draft', toStatus: 'sent', actorUserId: sales?.id ?? null, actorLabel: label(sales), detail: { via: 'link' } });
      if (wasViewed) await event('viewed', viewedAt, { fromStatus: 'sent', toStatus: 'viewed', actorLabel: 'Customer (comparison link)', detail: { linkId: link.id } });
      if (decided) await event(status, decidedAt, { fromStatus: 'viewed', toStatus: status, actorLabel: `${'decidedBy' in d ? d.decidedBy : 'Customer'} (customer)`, detail: { linkId: link.id, comment: 'comment' in d ? d.comment : null } });
      if (status === 'expired') await event('expired', new Date(`${addDays(validUntil, 1)}T00:05:00Z`), { fromStatus: 'viewed', toStatus: 'expired', actorLabel: 'FadeLedger (validity ended)' });
    }
  });
  if (openLinks.length) console.log(`demo quotes: customer pages (prefix with APP_URL; shown this once):\n  ${openLinks.join('\n  ')}`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  const names = DEMO_COMPANIES.map((c) => c.name);
  await qi.sequelize.query('DELETE q FROM quotes q JOIN companies c ON c.id = q.company_id WHERE c.name IN (:names)', { replacements: { names } });
  await qi.sequelize.query('UPDATE companies SET logo_mime = NULL, logo_data = NULL, logo_width = NULL, logo_height = NULL WHERE name IN (:names)', { replacements: { names } });
}
