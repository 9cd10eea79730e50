import { Document, Page, StyleSheet, Text, View } from '@react-pdf/renderer';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { formatMoney } from '@/server/money-format';
import { dishName, readStudyOption, savedMinutesNumber } from '@/server/study-option';
import { winAnsi as w } from '@/server/quotes/pdf/win-ansi';
import { PdfOutageChart } from './outage-chart';
import { climateLines, inputLines, pointingLines, recordCautions, type Line } from './study-record-words';
import { INK, MUTED, RULE, TEAL, TINT } from '@/server/pdf-palette';
import { footerTopPt } from '@/server/pdf-footer';

/** One service of the study: its inputs and its computed result (a study holds one today). */
export interface StudyRecordSection {
  inputs: StudyInputsSnapshot;
  result: StudyResultSnapshot;
}

export interface StudyRecordHeader {
  companyName: string;
  studyId: number;
  revision: number;
  title: string;
  createdByName: string | null;
}

export interface StudyRecordData {
  header: StudyRecordHeader;
  sections: StudyRecordSection[];
  generatedAt: Date;
}


const s = StyleSheet.create({
  page: { paddingTop: 36, paddingBottom: 52, paddingHorizontal: 40, fontFamily: 'Helvetica', fontSize: 8.5, color: INK, lineHeight: 1.3 },
  header: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end', borderBottomWidth: 2, borderBottomColor: TEAL, paddingBottom: 8, marginBottom: 10 },
  company: { fontFamily: 'Helvetica-Bold', fontSize: 13, color: TEAL },
  title: { fontFamily: 'Helvetica-Bold', fontSize: 12, marginBottom: 2 },
  small: { fontSize: 7.5, color: MUTED },
  h1: { fontFamily: 'Helvetica-Bold', fontSize: 11.5, color: INK, marginTop: 8, marginBottom: 2 },
  h2: { fontFamily: 'Helvetica-Bold', fontSize: 10, color: TEAL, marginTop: 10, marginBottom: 4 },
  bold: { fontFamily: 'Helvetica-Bold' },
  kv: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 2 },
  k: { width: '26%', color: MUTED, paddingRight: 6 },
  v: { width: '74%' },
  twoCols: { flexDirection: 'row', gap: 14 },
  col: { flex: 1 },
  tr: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 3 },
  trMark: { backgroundColor: TINT },
  th: { fontFamily: 'Helvetica-Bold', fontSize: 7, color: MUTED },
  num: { textAlign: 'right', paddingRight: 4 },
  box: { backgroundColor: TINT, padding: 7, borderRadius: 3, marginTop: 4 },
  caution: { marginBottom: 4 },
  // 7 pt text at the page's 1.3 line height, 4 pt above it: about 14 pt tall, 22 pt above the page's edge.
  footer: { position: 'absolute', top: footerTopPt(22, 14), left: 40, right: 40, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7, color: MUTED, borderTopWidth: 0.5, borderTopColor: RULE, paddingTop: 4 },
});

// Column widths of the per-dish table, in order.
const COLS = ['18%', '6%', '7%', '7%', '7%', '7%', '11%', '11%', '9%', '9%', '8%'] as const;
const HEADS = ['Dish', 'Gain dBi', 'G/T dB/K', 'Es/N0 dB', 'Margin dB', 'Fade thr. dB', 'Availability', 'Outage / yr', 'Worst month', 'Price', 'Saved min/yr'];
const WIDE_NO_CLOSE = '38%'; // Fade threshold to worst month, when the dish never works.

// Words are never split with a hyphen: terms like "Es/N0" and "availability" must stay readable.
const whole = (word: string) => [word];

function Pairs({ lines, keyWidth = '22%' }: { lines: Line[]; keyWidth?: string }) {
  return (
    <View>
      {lines.map(([k, v, note]) => (
        <View key={k} style={s.kv} wrap={false}>
          <Text style={[s.k, { width: keyWidth }]} hyphenationCallback={whole}>
            {w(k)}
          </Text>
          <Text style={[s.v, { width: `${100 - Number.parseFloat(keyWidth)}%` }]} hyphenationCallback={whole}>
            {w(v)}
            {note ? <Text style={s.small}>{w(`  ${note}`)}</Text> : null}
          </Text>
        </View>
      ))}
    </View>
  );
}

function DishTable({ inputs, result }: StudyRecordSection) {
  const t = result.tradeoff;
  const rec = t.recommendation;
  const cell = (i: number, numeric = true) => (numeric ? [{ width: COLS[i] }, s.num] : [{ width: COLS[i] }]);
  return (
    <View>
      <View style={s.tr} fixed>
        {HEADS.map((h, i) => (
          <Text key={h} style={[s.th, ...cell(i, i > 0)]}>
            {h}
          </Text>
        ))}
      </View>
      {t.options.map((o, i) => {
        const r = readStudyOption(t, i);
        const tags = [rec.smallestMeetingTargetIndex === i ? 'meets target' : null, rec.bestValueIndex === i ? 'best value' : null, rec.diminishingReturnsIndex === i ? 'diminishing returns' : null].filter(Boolean).join(', ');
        return (
          <View key={o.index} style={rec.smallestMeetingTargetIndex === i ? [s.tr, s.trMark] : s.tr} wrap={false}>
            <View style={{ width: COLS[0], paddingRight: 3 }}>
              <Text style={s.bold} hyphenationCallback={whole}>
                {w(dishName(inputs.dishes[i]?.name, o.diameterM))}
              </Text>
              <Text style={s.small} hyphenationCallback={whole}>
                {w(`${r.diameter.cm}${tags ? ` · ${tags}` : ''}`)}
              </Text>
            </View>
            <Text style={cell(1)}>{o.gainDbi.toFixed(1)}</Text>
            <Text style={cell(2)}>{o.gOverTDbK.toFixed(1)}</Text>
            <Text style={cell(3)}>{o.clearSkyEsN0Db.toFixed(2)}</Text>
            <Text style={cell(4)}>{w(o.marginDb.toFixed(2))}</Text>
            {r.closes ? (
              <>
                <Text style={cell(5)}>{o.fadeThresholdDb === null ? '-' : o.fadeThresholdDb.toFixed(2)}</Text>
                <Text style={cell(6)}>{w(r.availability.text)}</Text>
                <View style={cell(7)}>
                  <Text>{w(r.outage.minutesText)}</Text>
                  {r.outage.durationText !== r.outage.minutesText ? <Text style={s.small}>{w(r.outage.durationText)}</Text> : null}
                </View>
                <Text style={cell(8)}>{w(r.worstMonth.minutesText)}</Text>
              </>
            ) : (
              <Text style={[{ width: WIDE_NO_CLOSE }, { color: '#b91c1c', paddingRight: 4 }]}>{w(`Does not close${o.closes ? ' on the uplink' : ''}: never works with this carrier.`)}</Text>
            )}
            <Text style={cell(9)}>{w(formatMoney(o.priceUsd))}</Text>
            <Text style={cell(10)}>{i === rec.baselineIndex ? 'smallest' : w(savedMinutesNumber(o.minutesSavedPerYear))}</Text>
          </View>
        );
      })}
      <Text style={[s.small, { marginTop: 3 }]}>
        {w(
          `Outage figures are ${rec.basis === 'two-way' ? 'two-way (uplink + downlink added: an upper bound)' : 'for the downlink'}, in minutes of an average year; the worst month follows ITU-R P.841. Price: catalogue hardware and labour. Saved: outage minutes a year fewer than the smallest dish.`,
        )}
      </Text>
    </View>
  );
}

function Section({ section, index, count }: { section: StudyRecordSection; index: number; count: number }) {
  const { inputs, result } = section;
  const t = result.tradeoff;
  const rec = t.recommendation;
  const { lines: pointing } = pointingLines(inputs, result);
  const smallest = rec.smallestMeetingTargetIndex;
  return (
    <View break={index > 0}>
      {count > 1 ? <Text style={s.h1}>{w(`Service ${index + 1} of ${count}: ${inputs.service.name}`)}</Text> : null}
      <View style={s.box} wrap={false}>
        <Text>
          {smallest !== null
            ? w(`Smallest dish meeting the target of ${inputs.targetAvailabilityPercent} %: ${dishName(inputs.dishes[smallest]?.name, t.options[smallest].diameterM)} (${readStudyOption(t, smallest).diameter.cm}), ${readStudyOption(t, smallest).outage.phrase} of outage a year, ${formatMoney(t.options[smallest].priceUsd)}.`)
            : w(`No dish of this study meets the target of ${inputs.targetAvailabilityPercent} %.`)}
        </Text>
      </View>
      <View style={s.twoCols}>
        <View style={s.col}>
          <Text style={s.h2}>Inputs</Text>
          <Pairs lines={inputLines(inputs)} keyWidth="30%" />
        </View>
        <View style={s.col}>
          <Text style={s.h2}>Pointing</Text>
          <Pairs lines={pointing} keyWidth="36%" />
        </View>
      </View>
      <Text style={s.h2}>Climate and its sources</Text>
      <Pairs lines={climateLines(inputs, result)} />
      <Text style={s.h2}>Dish by dish</Text>
      <DishTable inputs={inputs} result={result} />
      <View wrap={false}>
        <Text style={s.h2}>Outage against dish size</Text>
        <PdfOutageChart result={result} targetPercent={inputs.targetAvailabilityPercent} width={515} />
      </View>
      <Text style={s.h2}>Cautions</Text>
      {recordCautions(inputs, result).map((c, i) => (
        <Text key={`${c.title}-${i}`} style={s.caution} wrap={false}>
          <Text style={s.bold}>{w(c.title)}. </Text>
          {w(c.body)}
        </Text>
      ))}
      <Text style={s.small}>{w(`Computed ${new Date(result.computedAt).toISOString().slice(0, 16).replace('T', ' ')} UTC with FadeLedger engine ${result.engineVersion}.`)}</Text>
    </View>
  );
}

/** The installer's engineering record of a study: inputs, sources, pointing, the per-dish table, the chart and the cautions, one section per service. */
export function StudyRecordDocument({ header, sections, generatedAt }: StudyRecordData) {
  const ref = `Study ${header.studyId}${header.revision > 1 ? ` rev. ${header.revision}` : ''}`;
  return (
    <Document title={w(`${ref} ${header.title}`)} author={w(header.companyName)} subject={w(`Engineering record: ${header.title}`)} creator="FadeLedger" producer="FadeLedger">
      <Page size="A4" style={s.page}>
        <View style={s.header} fixed>
          <Text style={s.company}>{w(header.companyName)}</Text>
          <View style={{ alignItems: 'flex-end' }}>
            <Text style={s.bold}>{w(`${ref} · engineering record`)}</Text>
            <Text style={s.small}>{w(`Printed ${generatedAt.toISOString().slice(0, 10)}${header.createdByName ? ` · study by ${header.createdByName}` : ''}`)}</Text>
          </View>
        </View>
        <Text style={s.title}>{w(header.title)}</Text>
        {sections.map((section, i) => (
          <Section key={i} section={section} index={i} count={sections.length} />
        ))}
        <View style={s.footer} fixed>
          <Text>{w(`${header.companyName} · ${ref} · predictions are statistics, not guarantees`)}</Text>
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
        </View>
      </Page>
    </Document>
  );
}
