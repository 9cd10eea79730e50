import { describe, expect, it } from 'vitest';
import { dishTradeoff, ENGINE_VERSION } from '@/server/engine';
import { buildScenario } from '@/server/studies/build-scenario';
import { mapsAtmosphere, mapsClimateSnapshot } from '@/server/studies/maps-climate';
import type { ClimateSnapshot, StudyInputsSnapshot } from '@/server/studies/snapshot';
import { quoteStudySnapshotOf, type StudyForQuote } from '@/server/quotes/options-of-study';
import { figuresSourceInWords } from '@/server/quotes/climate-words';
import type { QuoteStudySnapshot } from '@/server/quotes/snapshot';
import { climate as knownR001, SEVEN, service } from '../campaigns/campaign-fixture';

// An invented site and company (demo data); the service and dishes are the campaign fixture's.
const site = { id: 1, name: 'Heron gatehouse', customerId: 1, customerName: 'Perpetua Wold', latDeg: 47.25, lonDeg: 2.5, altitudeM: 180 };
const COMPANY = 'Fenwold Aerials';

/** A study as the quote copies it, computed by the real engine with the given climate (and atmosphere). */
function study(climate: ClimateSnapshot, withAtmosphere: boolean): StudyForQuote {
  const built = buildScenario({
    site,
    service,
    climate,
    dishes: SEVEN,
    targetAvailabilityPercent: 99.9,
    atmosphere: withAtmosphere ? mapsAtmosphere(site.latDeg, site.lonDeg, site.altitudeM / 1000) : null,
    fallbackIsothermKm: null,
  });
  const inputs: StudyInputsSnapshot = { schemaVersion: 1, site, service, climate, dishes: built.dishes, targetAvailabilityPercent: 99.9, downlinkTiltDeg: built.downlinkTiltDeg, scenario: built.scenario };
  const tradeoff = dishTradeoff(built.scenario);
  return { id: 7, title: 'Heron gatehouse', revision: 1, inputs, result: { schemaVersion: 1, engineVersion: ENGINE_VERSION, computedAt: '2026-03-02T10:00:00.000Z', tradeoff, exceedanceCurve: [] } };
}

describe('figuresSourceInWords: where a quote’s figures come from', () => {
  it('a study on the ITU-R maps with the total attenuation says both: maps at the site, gases and clouds counted', () => {
    const snap = quoteStudySnapshotOf(study(mapsClimateSnapshot(site.latDeg, site.lonDeg), true));
    expect(snap.climate.kind).toBe('itu-r-maps');
    expect(snap.attenuationModel).toBe('total');
    const words = figuresSourceInWords(snap, COMPANY);
    expect(words.rainClimate).toBe("Rain climate read from the ITU-R maps at your site's coordinates (ITU-R P.837-7, P.839-4).");
    expect(words.attenuation).toMatch(/count rain, clouds, the gases of the air and scintillation together/);
    expect(words.attenuation).toContain('ITU-R P.618 total attenuation');
    expect(words.attenuation).not.toMatch(/rain only/);
    expect(words.caution).toMatch(/not a guarantee/);
  });

  it('a rain-only study on a company profile names the profile, who chose it, and says rain only', () => {
    const snap = quoteStudySnapshotOf(study(knownR001, false));
    expect(snap.climate.kind).toBe('known-r001');
    expect(snap.attenuationModel).toBe('rain');
    const words = figuresSourceInWords(snap, COMPANY);
    expect(words.rainClimate).toBe('Rain climate from “Known”, a rain rate for the area entered by Fenwold Aerials.');
    expect(words.rainClimate).not.toMatch(/ITU-R maps/);
    expect(words.attenuation).toMatch(/^The outage figures count rain only/);
    expect(words.attenuation).toMatch(/are not included/);
  });

  it('a company’s measured record over the maps’ atmosphere: “a local rain record chosen by …”, with gases and clouds', () => {
    const measured: ClimateSnapshot = { id: 3, name: 'Fen station gauge 1998–2024', kind: 'measured-curve', data: { points: [{ pPercent: 1, rainRateMmH: 2.4 }, { pPercent: 0.1, rainRateMmH: 10.5 }, { pPercent: 0.01, rainRateMmH: 33 }, { pPercent: 0.001, rainRateMmH: 71 }] }, zeroIsothermKm: 2.8, sourceNote: 'invented' };
    const words = figuresSourceInWords(quoteStudySnapshotOf(study(measured, true)), COMPANY);
    expect(words.rainClimate).toBe('Rain climate from “Fen station gauge 1998–2024”, a local rain record chosen by Fenwold Aerials.');
    expect(words.attenuation).toMatch(/clouds, the gases of the air and scintillation together/);
  });

  it('a quote made before the maps (no kind, no model recorded) stays truthful: a chosen profile, rain only', () => {
    const old = { climate: { name: 'Coastal normals', sourceNote: 'invented' } } as Pick<QuoteStudySnapshot, 'climate' | 'attenuationModel'>;
    const words = figuresSourceInWords(old, COMPANY);
    expect(words.rainClimate).toBe('Rain climate from “Coastal normals”, a rain climate chosen by Fenwold Aerials.');
    expect(words.attenuation).toMatch(/^The outage figures count rain only/);
  });

  it('the other profile kinds say what they are', () => {
    const kindWords = (kind: NonNullable<QuoteStudySnapshot['climate']['kind']>) => figuresSourceInWords({ climate: { name: 'P', sourceNote: '', kind }, attenuationModel: 'total' }, COMPANY).rainClimate;
    expect(kindWords('monthly-normals')).toContain('local monthly rainfall and temperature averages chosen by Fenwold Aerials');
    expect(kindWords('climate-zone')).toContain('an ITU-R P.837-1 rain climate zone chosen by Fenwold Aerials');
  });
});
