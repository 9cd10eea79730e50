import { Document, Image, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import type { QuoteDetail } from '@/db/queries/quotes';
import { quoteCautions } from '../cautions';
import { figuresSourceInWords } from '../climate-words';
import { presentOptions, siteAndServiceInWords } from '../present';
import { effectiveStatus, isDecided, QUOTE_STATUS_LABELS, quoteReference } from '../status';
import { formatMoney } from '@/server/money-format';
import { diameterLabel } from '@/server/study-option';
import { winAnsi as w } from './win-ansi';
import { contactSentence, type SellerContact } from '../seller-contact';
import { INK, MUTED, RULE, TEAL, TINT } from '@/server/pdf-palette';
import { footerTopPt } from '@/server/pdf-footer';

export interface QuotePdfData {
  companyName: string;
  /** How the customer reaches the seller; printed under the company name and at the end. */
  contact?: SellerContact | null;
  logo: { data: Buffer; mime: 'image/png' | 'image/jpeg'; width: number; height: number } | null;
  quote: QuoteDetail;
  generatedAt: Date;
}


const s = StyleSheet.create({
  page: { paddingTop: 40, paddingBottom: 56, paddingHorizontal: 44, fontFamily: 'Helvetica', fontSize: 9.5, color: INK, lineHeight: 1.35 },
  header: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start', borderBottomWidth: 2, borderBottomColor: TEAL, paddingBottom: 10, marginBottom: 14 },
  company: { fontFamily: 'Helvetica-Bold', fontSize: 15, color: TEAL },
  refBlock: { alignItems: 'flex-end' },
  ref: { fontFamily: 'Helvetica-Bold', fontSize: 13 },
  small: { fontSize: 8.5, color: MUTED },
  h2: { fontFamily: 'Helvetica-Bold', fontSize: 11, color: TEAL, marginTop: 14, marginBottom: 5 },
  para: { marginBottom: 4 },
  box: { backgroundColor: TINT, padding: 9, borderRadius: 3, marginTop: 4 },
  boxTitle: { fontFamily: 'Helvetica-Bold', fontSize: 11, marginBottom: 3 },
  table: { borderTopWidth: 1, borderTopColor: RULE, marginTop: 2 },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: RULE, paddingVertical: 4 },
  trQuoted: { backgroundColor: TINT },
  th: { fontFamily: 'Helvetica-Bold', fontSize: 8.5, color: MUTED },
  cDish: { width: '24%', paddingRight: 4 },
  cWords: { width: '40%', paddingRight: 6 },
  cAvail: { width: '16%', textAlign: 'right', paddingRight: 6 },
  cPrice: { width: '20%', textAlign: 'right' },
  priceRow: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: 2.5, borderBottomWidth: 1, borderBottomColor: RULE },
  totalRow: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: 4, marginTop: 2 },
  bold: { fontFamily: 'Helvetica-Bold' },
  caution: { marginBottom: 5 },
  // 7.5 pt text at the page's 1.35 line height, 5 pt above it: about 16 pt tall, 24 pt above the page's edge.
  footer: { position: 'absolute', top: footerTopPt(24, 16), left: 44, right: 44, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7.5, color: MUTED, borderTopWidth: 1, borderTopColor: RULE, paddingTop: 5 },
});

const dateWords = (iso: string) => new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

function logoBox(logo: NonNullable<QuotePdfData['logo']>): { width: number; height: number } {
  // Fit within 150 × 48 pt, keeping the aspect ratio.
  const scale = Math.min(150 / logo.width, 48 / logo.height, 1);
  return { width: logo.width * scale, height: logo.height * scale };
}

/** The quote as a printable document: the same words and figures as the customer's page. */
/**
 * A section heading kept with what follows: react-pdf moves it to the next page when less than
 * `minPresenceAhead` points of content would follow it on this one, so no heading sits alone at a
 * page foot (tests/unit/quotes/pdf-layout.test.ts checks every page's last line).
 */
function Heading({ children, ahead = 90 }: { children: string; ahead?: number }) {
  return (
    <Text style={s.h2} minPresenceAhead={ahead}>
      {w(children)}
    </Text>
  );
}

export function QuoteDocument({ companyName, logo, quote, generatedAt, contact = null }: QuotePdfData) {
  const reach = contact ? contactSentence(contact) : null;
  const ref = quoteReference(quote.number);
  const money = (a: string) => w(formatMoney(a, quote.currency));
  const words = siteAndServiceInWords(quote.studySnapshot);
  const options = presentOptions(quote.options, quote.chosenOptionIndex);
  const chosen = options.find((o) => o.quoted);
  const cautions = quoteCautions({ transmits: quote.studySnapshot.service.transmits });
  const sources = figuresSourceInWords(quote.studySnapshot, companyName);
  // The Recommendations behind the figures: P.676 and P.840 only when gases and clouds were counted.
  const methods = quote.studySnapshot.attenuationModel === 'total' ? 'ITU-R P.618, P.676, P.837, P.838, P.839, P.840, P.841' : 'ITU-R P.618, P.837, P.838, P.839, P.841';
  return (
    <Document title={w(`${ref} ${companyName}`)} author={w(companyName)} subject={w(`Quote for ${quote.siteName}`)} creator="FadeLedger" producer="FadeLedger">
      <Page size="A4" style={s.page}>
        <View style={s.header} fixed>
          <View>
            {logo ? <Image src={{ data: logo.data, format: logo.mime === 'image/png' ? 'png' : 'jpg' }} style={{ ...logoBox(logo), marginBottom: 4 }} /> : null}
            <Text style={s.company}>{w(companyName)}</Text>
            {contact && (contact.email || contact.phone) ? (
              <Text style={s.small}>{w([contact.email, contact.phone].filter(Boolean).join(' · '))}</Text>
            ) : null}
          </View>
          <View style={s.refBlock}>
            <Text style={s.ref}>Quote {ref}</Text>
            <Text style={s.small}>Issued {dateWords(quote.sentAt ?? quote.createdAt)} · valid until {dateWords(quote.validUntil)}</Text>
            <Text style={s.small}>Status: {QUOTE_STATUS_LABELS[effectiveStatus(quote.status, quote.validUntil, generatedAt)]}</Text>
          </View>
        </View>

        <Text style={s.para}>
          <Text style={s.bold}>For: </Text>
          {w(quote.customerName)}
          {quote.customerEmail ? w(` <${quote.customerEmail}>`) : ''}
        </Text>
        <Text style={s.para}>
          <Text style={s.bold}>Site: </Text>
          {w(words.site)}
        </Text>
        <Text style={s.para}>
          <Text style={s.bold}>Service: </Text>
          {w(words.service)}
        </Text>
        <Text style={s.para}>{w(words.pointing)}</Text>
        <Text style={s.para}>
          <Text style={s.bold}>Weather data: </Text>
          {w(`${sources.rainClimate} ${sources.attenuation}`)}
        </Text>

        {chosen ? (
          <View style={s.box} wrap={false}>
            <Text style={s.boxTitle}>{w(`We recommend: ${chosen.label}, ${chosen.reading.diameter.words}`)}</Text>
            <Text>{w(chosen.reading.outage.yearWords)}</Text>
            {chosen.reading.worstMonth.words ? <Text>{w(chosen.reading.worstMonth.words)}</Text> : null}
            <Text>{w(`Signal available ${chosen.reading.availability.words}.`)}</Text>
            {chosen.saving ? <Text>{w(chosen.saving)}</Text> : null}
          </View>
        ) : null}

        <Heading>The options we compared</Heading>
        <View style={s.table}>
          <View style={s.tr}>
            <Text style={[s.th, s.cDish]}>Dish</Text>
            <Text style={[s.th, s.cWords]}>Without signal (average year)</Text>
            <Text style={[s.th, s.cAvail]}>Availability</Text>
            <Text style={[s.th, s.cPrice]}>Dish and fitting</Text>
          </View>
          {options.map((o) => (
            <View key={o.option.index} style={o.quoted ? [s.tr, s.trQuoted] : s.tr} wrap={false}>
              <View style={s.cDish}>
                <Text style={s.bold}>{w(o.label)}</Text>
                <Text style={s.small}>{w(o.reading.diameter.words)}{o.quoted ? ' · quoted' : ''}</Text>
              </View>
              <View style={s.cWords}>
                <Text>{w(o.reading.outage.yearWords)}</Text>
                {o.reading.worstMonth.words ? <Text style={s.small}>{w(o.reading.worstMonth.words)}</Text> : null}
              </View>
              <Text style={s.cAvail}>{w(o.reading.availability.text)}</Text>
              <Text style={s.cPrice}>{money(o.option.cataloguePrice)}</Text>
            </View>
          ))}
        </View>
        <Text style={[s.small, { marginTop: 3 }]}>Dish and fitting: catalogue hardware and labour, before extras, discount and tax. Availability is the share of an average year with signal.</Text>

        {/* Heading and price lines move together: the price block never starts a page without its title. */}
        <View wrap={false}>
          <Text style={s.h2}>Price of the quoted option</Text>
          <View style={s.priceRow}>
            <Text>{w(`Hardware: ${chosen ? chosen.label : diameterLabel(quote.chosenOption.diameterM).words}`)}</Text>
            <Text>{money(quote.hardwarePrice)}</Text>
          </View>
          <View style={s.priceRow}>
            <Text>Installation labour</Text>
            <Text>{money(quote.labourPrice)}</Text>
          </View>
          {Number(quote.extrasPrice) > 0 ? (
            <View style={s.priceRow}>
              <Text>{w(quote.extrasLabel ?? 'Extras')}</Text>
              <Text>{money(quote.extrasPrice)}</Text>
            </View>
          ) : null}
          {Number(quote.discountAmount) > 0 ? (
            <View style={s.priceRow}>
              <Text>Discount</Text>
              <Text>-{money(quote.discountAmount)}</Text>
            </View>
          ) : null}
          <View style={s.priceRow}>
            <Text>Subtotal</Text>
            <Text>{money(quote.subtotal)}</Text>
          </View>
          <View style={s.priceRow}>
            <Text>{`Tax (${Number(quote.taxRatePercent)} %)`}</Text>
            <Text>{money(quote.taxAmount)}</Text>
          </View>
          <View style={s.totalRow}>
            <Text style={s.bold}>Total</Text>
            <Text style={s.bold}>{money(quote.total)}</Text>
          </View>
        </View>

        {quote.notes ? (
          <>
            <Heading ahead={40}>Notes</Heading>
            <Text>{w(quote.notes)}</Text>
          </>
        ) : null}

        {isDecided(quote.status) ? (
          <View style={[s.box, { marginTop: 12 }]} wrap={false}>
            <Text style={s.bold}>{w(`${quote.status === 'accepted' ? 'Accepted' : 'Declined'} by ${quote.decidedByName ?? 'the customer'} on ${quote.decidedAt ? dateWords(quote.decidedAt) : ''}.`)}</Text>
          </View>
        ) : null}

        {reach ? (
          <View wrap={false}>
            <Text style={s.h2}>Your contact</Text>
            <Text>{w(reach)}</Text>
          </View>
        ) : null}

        <Heading>Please read</Heading>
        {cautions.map((c) => (
          <Text key={c.title} style={s.caution} wrap={false}>
            <Text style={s.bold}>{w(c.title)}. </Text>
            {w(c.body)}
          </Text>
        ))}
        <Text style={s.small}>
          {w(`Figures from a study computed on ${dateWords(quote.studySnapshot.computedAt)} with FadeLedger engine ${quote.studySnapshot.engineVersion} (${methods}); rain climate: ${quote.studySnapshot.climate.name}. ${sources.caution}`)}
        </Text>

        <View style={s.footer} fixed>
          <Text>{w(`${companyName} · ${ref} · predictions are statistics, not guarantees`)}</Text>
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages} · ${generatedAt.toISOString().slice(0, 10)}`} />
        </View>
      </Page>
    </Document>
  );
}
