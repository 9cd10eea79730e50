import { readStudyOption } from '@/server/study-option';
import type { DishSnapshot, StudyInputsSnapshot, StudyResultSnapshot } from './snapshot';

/**
 * Several services for one site, compared dish by dish. Pure and browser-safe: the study page
 * and the study PDF read the same verdict.
 */
export interface ServiceSection {
  inputs: StudyInputsSnapshot;
  result: StudyResultSnapshot;
}

/** The same catalogue dish in every service's table: by its id, else (a dish deleted since) by size and name. */
function dishKey(d: DishSnapshot | undefined, diameterM: number): string {
  return d?.dishId != null ? `id:${d.dishId}` : `m:${diameterM}:${d?.name ?? ''}`;
}

export interface EveryTargetVerdict {
  /** The smallest dish meeting every service's own target; null when no dish of the study does. */
  dish: { name: string; diameterM: number; optionIndexes: number[] } | null;
  /** Per service, in the sections' order: the smallest dish meeting that service's target (an option index), or null. */
  smallestPerService: (number | null)[];
}

/**
 * The smallest dish that meets the target availability of every service of the study, each on
 * its own basis (two-way for a transmitting service), read through the option read model. A dish
 * missing from one service's table (it cannot happen for studies saved together) counts as not
 * meeting that service's target.
 */
export function smallestDishMeetingEveryTarget(sections: ServiceSection[]): EveryTargetVerdict {
  const smallestPerService = sections.map((s) => s.result.tradeoff.recommendation.smallestMeetingTargetIndex);
  if (sections.length === 0) return { dish: null, smallestPerService };
  const indexOf = sections.map((s) => new Map(s.result.tradeoff.options.map((o, i) => [dishKey(s.inputs.dishes[i], o.diameterM), i])));
  const first = sections[0];
  const bySize = first.result.tradeoff.options.map((o, i) => ({ o, i })).sort((a, b) => a.o.diameterM - b.o.diameterM);
  for (const { o, i } of bySize) {
    const key = dishKey(first.inputs.dishes[i], o.diameterM);
    const optionIndexes = indexOf.map((m) => m.get(key) ?? -1);
    const meetsAll = optionIndexes.every((idx, s) => idx >= 0 && readStudyOption(sections[s].result.tradeoff, idx).meetsTarget);
    if (meetsAll) return { dish: { name: first.inputs.dishes[i]?.name ?? '', diameterM: o.diameterM, optionIndexes }, smallestPerService };
  }
  return { dish: null, smallestPerService };
}
