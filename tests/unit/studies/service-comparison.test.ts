import { describe, expect, it } from 'vitest';
import { smallestDishMeetingEveryTarget, type ServiceSection } from '@/server/studies/comparison';
import { studyInputChanges, type StudyChoiceView } from '@/server/studies/input-changes';

/** A stored service with just what the comparison reads: dishes, and per option whether it closes and meets the target. */
function section(name: string, options: { cm: number; meets: boolean | null; closes?: boolean; dishId?: number | null }[], order?: number[]): ServiceSection {
  const rows = (order ?? options.map((_, i) => i)).map((i) => options[i]);
  const outage = { outagePercent: 0.01, outageBound: 'none', availabilityPercent: 99.99, outageMinutesPerYear: 52.6, worstMonthOutageMinutes: 20 };
  return {
    inputs: { service: { name }, targetAvailabilityPercent: 99.9, dishes: rows.map((o) => ({ dishId: o.dishId === undefined ? o.cm : o.dishId, name: `Dish ${o.cm}`, diameterM: o.cm / 100 })) },
    result: {
      tradeoff: {
        options: rows.map((o) => ({ diameterM: o.cm / 100, closes: o.closes ?? true, uplink: null, twoWay: null, meetsTarget: o.meets, ...outage })),
        recommendation: { basis: 'downlink', smallestMeetingTargetIndex: rows.findIndex((o) => o.meets) === -1 ? null : rows.findIndex((o) => o.meets) },
      },
    },
  } as unknown as ServiceSection;
}

describe('smallestDishMeetingEveryTarget', () => {
  it('takes the smallest dish that meets both targets, not either service’s own smallest', () => {
    const tv = section('TV', [{ cm: 60, meets: true }, { cm: 90, meets: true }, { cm: 120, meets: true }]);
    const ka = section('Ka', [{ cm: 60, meets: false }, { cm: 90, meets: false }, { cm: 120, meets: true }]);
    const v = smallestDishMeetingEveryTarget([tv, ka]);
    expect(v.dish).toMatchObject({ name: 'Dish 120', diameterM: 1.2, optionIndexes: [2, 2] });
    expect(v.smallestPerService).toEqual([0, 2]);
  });

  it('says none when no dish meets every target; a dish that does not close never meets', () => {
    const tv = section('TV', [{ cm: 60, meets: false }, { cm: 90, meets: true }]);
    const ka = section('Ka', [{ cm: 60, meets: true }, { cm: 90, meets: true, closes: false }]);
    expect(smallestDishMeetingEveryTarget([tv, ka]).dish).toBeNull();
    expect(smallestDishMeetingEveryTarget([section('TV', [{ cm: 60, meets: null }])]).dish).toBeNull();
  });

  it('matches dishes by catalogue id whatever their order in each table', () => {
    const tv = section('TV', [{ cm: 60, meets: true }, { cm: 90, meets: true }]);
    const ka = section('Ka', [{ cm: 90, meets: true }, { cm: 60, meets: false }]);
    expect(smallestDishMeetingEveryTarget([tv, ka]).dish).toMatchObject({ diameterM: 0.9, optionIndexes: [1, 0] });
  });
});

describe('studyInputChanges', () => {
  const before: StudyChoiceView = { customer: 'Fenwold Farm', site: 'Long barn roof', services: ['TV'], climate: 'ITU-R maps', dishes: ['Quill 60', 'Quill 90'], targetAvailabilityPercent: 99.9, title: 'Barn' };

  it('lists nothing when nothing changed (dish order does not count)', () => {
    expect(studyInputChanges(before, { ...before, dishes: ['Quill 90', 'Quill 60'] })).toEqual([]);
  });

  it('lists each changed field old → new', () => {
    const out = studyInputChanges(before, { ...before, targetAvailabilityPercent: 99.95, services: ['TV', 'Ka two-way'], dishes: ['Quill 90', 'Quill 120'], title: '' });
    expect(out).toEqual([
      { field: 'services', label: 'Services', from: 'TV', to: 'TV, Ka two-way' },
      { field: 'dishes', label: 'Dishes', from: 'Quill 60, Quill 90', to: 'adds Quill 120; drops Quill 60' },
      { field: 'targetAvailabilityPercent', label: 'Target availability', from: '99.9 %', to: '99.95 %' },
      { field: 'title', label: 'Title', from: 'Barn', to: 'the default title' },
    ]);
  });
});
