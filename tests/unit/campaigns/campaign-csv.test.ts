import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { CAMPAIGN_MAX_ROWS, parseCampaignCsv } from '@/server/campaigns/campaign-csv';
import { CAMPAIGN_RESULT_HEADER, campaignResultCsv } from '@/server/campaigns/campaign-result-csv';

// Invented site references and coordinates (demo data).
const HEADER = 'site_ref,latitude,longitude,altitude_m,current_dish_cm';

describe('parseCampaignCsv', () => {
  it('reads decimal and DMS coordinates, keeping each row its line number', () => {
    const r = parseCampaignCsv(`${HEADER}\nFW-001,47.25,2.5,180,60\nFW-002,"47°15'00"" N",2 30 0 E,90.5,90\n`);
    expect(r.problems).toEqual([]);
    expect(r.rows).toEqual([
      { line: 2, siteRef: 'FW-001', latDeg: 47.25, lonDeg: 2.5, altitudeM: 180, currentDishCm: 60 },
      { line: 3, siteRef: 'FW-002', latDeg: 47.25, lonDeg: 2.5, altitudeM: 90.5, currentDishCm: 90 },
    ]);
    expect(r.rowCount).toBe(2);
  });

  it('names the line and column of a bad number and keeps the good rows', () => {
    const r = parseCampaignCsv(`${HEADER}\nA,47.25,2.5,180,60\nB,47.25,2.5,12,5,90\nC,47.25,2.5,abc,90\nD,47.25,2.5,100,60\n`);
    expect(r.rows.map((x) => x.siteRef)).toEqual(['A', 'D']);
    expect(r.problems).toHaveLength(2);
    expect(r.problems[0]).toMatchObject({ line: 3 });
    expect(r.problems[1]).toEqual({ line: 4, siteRef: 'C', column: 'altitude_m', message: 'Line 4, altitude_m: "abc" is not a number (use a decimal point, e.g. 120.5).' });
  });

  it('reports a bad coordinate with the coordinate parser’s own words', () => {
    const r = parseCampaignCsv(`${HEADER}\nA,12 75 0 N,2.5,100,60\nB,47.25,95 E,100,60\n`);
    expect(r.rows.map((x) => x.siteRef)).toEqual(['B']);
    expect(r.problems).toEqual([{ line: 2, siteRef: 'A', column: 'latitude', message: 'Line 2, latitude: Minutes must be below 60.' }]);
  });

  it('says the axis once and quotes a bad coordinate as it was typed', () => {
    const r = parseCampaignCsv(`${HEADER}\nA,ninety,2.5,100,60\nB,95.0,2.5,100,60\nC,47.25,2.5 w,100,60\n`);
    expect(r.rows.map((x) => [x.siteRef, x.lonDeg])).toEqual([['C', -2.5]]);
    expect(r.problems.map((p) => p.message)).toEqual(['Line 2, latitude: "ninety" is not a number.', 'Line 3, latitude must be between -90 and 90 degrees.']);
  });

  it('refuses a missing column, naming it, with no rows', () => {
    const r = parseCampaignCsv('site_ref,latitude,longitude,altitude_m\nA,47.25,2.5,100\n');
    expect(r.rows).toEqual([]);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0].message).toContain('Missing column: current_dish_cm');
  });

  it('refuses an empty file and a header without rows', () => {
    expect(parseCampaignCsv('').problems).toEqual([{ line: null, message: 'The file is empty.' }]);
    expect(parseCampaignCsv(' \n\n').problems[0].message).toBe('The file is empty.');
    expect(parseCampaignCsv(`${HEADER}\n`).problems[0].message).toBe('The file has a header line but no data rows.');
  });

  it('refuses more than the row limit as a whole', () => {
    const lines = Array.from({ length: CAMPAIGN_MAX_ROWS + 1 }, (_, i) => `S${i},47,2,100,60`);
    const r = parseCampaignCsv(`${HEADER}\n${lines.join('\n')}\n`);
    expect(r.rows).toEqual([]);
    expect(r.problems[0].message).toContain(`at most ${CAMPAIGN_MAX_ROWS}`);
  });

  it('takes a blank altitude, or no altitude_m column at all, as "not known" (the maps give it), and says so in the header message', () => {
    const blank = parseCampaignCsv(`${HEADER}\nA,47.25,2.5,,60\nB,47.25,2.5,180,60\n`);
    expect(blank.problems).toEqual([]);
    expect(blank.rows.map((r) => r.altitudeM)).toEqual([null, 180]);
    const without = parseCampaignCsv('site_ref,latitude,longitude,current_dish_cm\nA,47.25,2.5,60\n');
    expect(without.problems).toEqual([]);
    expect(without.rows).toEqual([{ line: 2, siteRef: 'A', latDeg: 47.25, lonDeg: 2.5, altitudeM: null, currentDishCm: 60 }]);
    expect(parseCampaignCsv('site_ref,latitude,longitude\nA,47,2\n').problems[0].message).toContain('(optional: altitude_m)');
  });

  it('out-of-range altitude and dish size are line problems', () => {
    const r = parseCampaignCsv(`${HEADER}\nA,47,2,9000,60\nB,47,2,100,0\n`);
    expect(r.problems.map((p) => [p.line, p.column])).toEqual([[2, 'altitude_m'], [3, 'current_dish_cm']]);
  });
});

describe('campaignResultCsv', () => {
  it('writes a header with units and neutralises spreadsheet formulas in site references', () => {
    const text = campaignResultCsv(
      [
        {
          line: 2, siteRef: '=HYPERLINK("x")', currentDishCm: 60, currentDishName: 'D60', currentCloses: true, currentOutageMinutesPerYear: 812.34, currentOutageBound: 'none', currentAvailabilityPercent: 99.84546, outageIsTwoWaySum: false, verdict: 'upgrade',
          recommendedDishName: 'D90', recommendedDishCm: 90, recommendedOutageMinutesPerYear: 300.01, recommendedOutageBound: 'below-model-range', minutesSavedPerYear: 512.33, upgradePriceUsd: '279.00', upgradeHardwareUsd: '199.00', upgradeLabourUsd: '80.00', currentDishAssumed: false,
          climate: { r001MmH: 31.27, rainClimateSource: 'ITU-R maps at the site (P.837-7 Annex 1)', rainHeightKm: 2.7665, rainHeightSource: 'ITU-R maps at the site (P.839-4)', altitudeM: 212, altitudeSource: 'ITU-R P.1511-1' },
          attenuationModel: 'total',
          currentAttenuation: { gasDb: 0.0712, cloudDb: 0.2551, rainDb: 3.1049, scintillationDb: 0.1833, totalDb: 3.4399 },
        },
      ],
      [{ line: 3, siteRef: 'FW-9', message: 'Line 3: bad.' }, { line: 1, message: 'Line 1: first.' }],
    );
    const parsed = Papa.parse<string[]>(text.trim()).data;
    expect(parsed[0]).toEqual([...CAMPAIGN_RESULT_HEADER]);
    expect(parsed[0]).toContain('current_outage_min_per_year');
    expect(parsed[0]).toContain('upgrade_price_usd');
    // In the file's line order, problems included, with their site reference.
    expect(parsed.map((r) => r[0])).toEqual(['line', '1', '2', '3']);
    // The study's one rounding rule (server/study-option): outages up (an upper bound too), availability and savings down.
    expect(parsed[2]).toEqual([
      '2', `'=HYPERLINK("x")`, 'D60', '60', '813', '', '99.845', 'upgrade', 'D90', '90', '301', 'at most', '512', '279.00',
      '31.3', 'ITU-R maps at the site (P.837-7 Annex 1)', '2.767', 'ITU-R maps at the site (P.839-4)', '212', 'ITU-R P.1511-1 at the site',
      'total: gases, clouds, rain, scintillation', '0.07', '0.26', '3.10', '0.18', '3.44',
    ]);
    for (const column of ['r001_mm_h', 'rain_height_km', 'altitude_m_used', 'altitude_source', 'current_outage_gas_db', 'current_outage_scintillation_db']) expect(parsed[0]).toContain(column);
    expect(parsed[3].slice(0, 2)).toEqual(['3', 'FW-9']);
    // A row that was not computed has no climate figures either.
    expect(parsed[3].slice(CAMPAIGN_RESULT_HEADER.indexOf('r001_mm_h')).every((c) => c === '')).toBe(true);
    expect(parsed[3][CAMPAIGN_RESULT_HEADER.indexOf('recommendation')]).toBe('not computed: Line 3: bad.');
  });

  it('says when the outages are two-way sums, and leaves the availability of a dish that never works blank', () => {
    const base = {
      line: 2, siteRef: 'V-1', currentDishCm: 60, currentDishName: 'D60', currentOutageBound: 'none' as const, verdict: 'none-meets-target' as const,
      recommendedDishName: null, recommendedDishCm: null, recommendedOutageMinutesPerYear: null, recommendedOutageBound: null, minutesSavedPerYear: null, upgradePriceUsd: null, upgradeHardwareUsd: null, upgradeLabourUsd: null, currentDishAssumed: false,
      climate: { r001MmH: 31.27, rainClimateSource: 'x', rainHeightKm: 2.7665, rainHeightSource: 'y', altitudeM: 212, altitudeSource: 'file' as const },
      attenuationModel: 'rain' as const, currentAttenuation: null,
    };
    const text = campaignResultCsv([
      { ...base, currentCloses: true, currentOutageMinutesPerYear: 262.98, currentAvailabilityPercent: 99.95, outageIsTwoWaySum: true },
      { ...base, line: 3, currentCloses: false, currentOutageMinutesPerYear: 525960, currentAvailabilityPercent: 0, outageIsTwoWaySum: true },
    ]);
    const [, twoWay, never] = Papa.parse<string[]>(text.trim()).data;
    const at = (name: (typeof CAMPAIGN_RESULT_HEADER)[number]) => CAMPAIGN_RESULT_HEADER.indexOf(name);
    expect([twoWay[at('current_outage_min_per_year')], twoWay[at('current_outage_bound')], twoWay[at('current_availability_percent')]]).toEqual(['263', 'at most (two-way sum)', '99.950']);
    expect(never[at('current_availability_percent')]).toBe('');
  });
});
