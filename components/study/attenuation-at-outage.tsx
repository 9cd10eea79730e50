import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import type { AttenuationComponents } from '@/server/engine/p618-total-attenuation';
import type { OutageFigures } from '@/server/engine/outage-figures';
import { Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { dishName, outagePercentText, outageQualifier } from '@/server/study-option';
import { fixed } from './format';

/** Share of the year of one link (not the two-way sum), rounded by the one rule and signed by its model-range bound. */
function percentText(f: Pick<OutageFigures, 'outagePercent' | 'outageBound'>): string {
  return outagePercentText(f.outagePercent, outageQualifier({ outageBound: f.outageBound, isUpperBound: false }));
}

/** Bounded outages: the total never reaches the threshold inside 0.001–5 % (or always exceeds it), so it differs from it. */
function offThreshold(l: { at: AttenuationComponents; thresholdDb: number | null }): boolean {
  return l.thresholdDb !== null && Math.abs(l.at.totalDb - l.thresholdDb) > 0.005;
}

type Line = { key: string; dish: string; link: string; figures: Pick<OutageFigures, 'outagePercent' | 'outageBound'>; at: AttenuationComponents; thresholdDb: number | null };

/**
 * For 'total' studies: each dish's gas, cloud, rain and scintillation attenuation at its outage,
 * and their ITU-R P.618-14 §2.5 total, which equals its fade threshold unless the outage is
 * bounded by the model range. A narrow table under the main one, so that one keeps its width.
 */
export function AttenuationAtOutage({ inputs, result }: { inputs: StudyInputsSnapshot; result: StudyResultSnapshot }) {
  const t = result.tradeoff;
  if (t.attenuationModel !== 'total') return null;
  const lines: Line[] = [];
  t.options.forEach((o, i) => {
    const dish = dishName(inputs.dishes[i]?.name, o.diameterM);
    if (o.attenuationAtOutage) lines.push({ key: `${i}-down`, dish, link: 'downlink', figures: o, at: o.attenuationAtOutage, thresholdDb: o.fadeThresholdDb });
    if (o.uplink?.attenuationAtOutage) lines.push({ key: `${i}-up`, dish, link: 'uplink', figures: o.uplink, at: o.uplink.attenuationAtOutage, thresholdDb: o.uplink.fadeThresholdDb });
  });
  if (!lines.length) return null;
  const twoLinks = lines.some((l) => l.link === 'uplink');
  return (
    <div className="border-t border-stone-200 pt-4">
      <div className="px-4 sm:px-5">
        <h3 id="attenuation-at-outage-title" className="text-sm font-semibold text-stone-900">
          Attenuation at outage, by cause
        </h3>
        <p className="mt-1 max-w-3xl text-xs text-stone-600">
          Each dish is out when the total attenuation reaches its fade threshold. The total (ITU-R P.618-14 §2.5) is gases + √((rain + clouds)² +
          scintillation²), with gases and clouds held at their 1 % values below 1 % of the year, so the four parts do not simply add up. Gases P.676-12,
          clouds P.840-8, rain P.618-14, scintillation P.618-14 §2.4.1, all at the share of the year given under each dish.
        </p>
      </div>
      {/* Phones: one block per dish with the five figures side by side; wider screens: the table. */}
      <ul className="mt-3 divide-y divide-stone-200 border-t border-stone-200 sm:hidden">
        {lines.map((l) => (
          <li key={l.key} className="px-4 py-2">
            <p className="text-sm text-stone-900">
              {l.dish}
              {twoLinks && <span className="text-stone-600"> · {l.link}</span>}
              <span className="text-xs text-stone-600"> · at {percentText(l.figures)} of the year</span>
            </p>
            <dl className="mt-1 grid grid-cols-5 gap-1 text-xs">
              {(
                [
                  ['Gases', l.at.gasDb],
                  ['Clouds', l.at.cloudDb],
                  ['Rain', l.at.rainDb],
                  ['Scint.', l.at.scintillationDb],
                  ['Total', l.at.totalDb],
                ] as const
              ).map(([term, db]) => (
                <div key={term}>
                  <dt className="text-stone-600">{term}</dt>
                  <dd className={`num text-left text-stone-900 ${term === 'Total' ? 'font-medium' : ''}`}>{fixed(db, 2)} dB</dd>
                </div>
              ))}
            </dl>
            {offThreshold(l) && <p className="mt-1 text-xs text-stone-600">Fade threshold {fixed(l.thresholdDb as number, 2)} dB (outage at the end of the model range).</p>}
          </li>
        ))}
      </ul>
      <Table caption="Attenuation at outage, by cause" className="mt-2 hidden max-w-4xl sm:block">
        <THead>
          <tr>
            <Th>Dish{twoLinks ? ' · link' : ''}</Th>
            <Th numeric className="normal-case">Gases dB</Th>
            <Th numeric className="normal-case">Clouds dB</Th>
            <Th numeric className="normal-case">Rain dB</Th>
            <Th numeric className="normal-case">Scint. dB</Th>
            <Th numeric className="normal-case">Total dB</Th>
          </tr>
        </THead>
        <TBody>
          {lines.map((l) => (
            <tr key={l.key}>
              <Th scope="row" className="whitespace-nowrap font-normal">
                <span className="block text-stone-900">
                  {l.dish}
                  {twoLinks && <span className="text-stone-600"> · {l.link}</span>}
                </span>
                <span className="num block text-left text-xs text-stone-600">at {percentText(l.figures)} of the year</span>
              </Th>
              <Td numeric>{fixed(l.at.gasDb, 2)}</Td>
              <Td numeric>{fixed(l.at.cloudDb, 2)}</Td>
              <Td numeric>{fixed(l.at.rainDb, 2)}</Td>
              <Td numeric>{fixed(l.at.scintillationDb, 2)}</Td>
              <Td numeric className="whitespace-nowrap font-medium">
                {fixed(l.at.totalDb, 2)}
                <span className="block text-xs font-normal text-stone-600">{offThreshold(l) ? `threshold ${fixed(l.thresholdDb as number, 2)}` : '= fade threshold'}</span>
              </Td>
            </tr>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
