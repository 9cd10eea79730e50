/**
 * What an edit changes in a study's inputs, in words, before it is saved as the next revision.
 * Pure and browser-safe: the form shows the list as the installer edits.
 */
export interface StudyChoiceView {
  customer: string;
  site: string;
  /** The main service first. */
  services: string[];
  climate: string;
  dishes: string[];
  targetAvailabilityPercent: number | null;
  title: string;
}

export interface InputChange {
  field: 'customer' | 'site' | 'services' | 'climate' | 'dishes' | 'targetAvailabilityPercent' | 'title';
  label: string;
  from: string;
  to: string;
}

const NONE = 'none';

function listText(items: string[]): string {
  return items.length ? items.join(', ') : NONE;
}

/** The fields that differ, old → new, in the form's order. A blank new title means the default title. */
export function studyInputChanges(before: StudyChoiceView, after: StudyChoiceView): InputChange[] {
  const out: InputChange[] = [];
  const add = (field: InputChange['field'], label: string, from: string, to: string) => {
    if (from !== to) out.push({ field, label, from, to });
  };
  add('customer', 'Customer', before.customer, after.customer);
  add('site', 'Site', before.site, after.site);
  // Order matters for services (the first one leads the study); for dishes it does not (the table sorts by size).
  add('services', before.services.length > 1 || after.services.length > 1 ? 'Services' : 'Service', listText(before.services), listText(after.services));
  add('climate', 'Rain climate', before.climate, after.climate);
  const removed = before.dishes.filter((d) => !after.dishes.includes(d));
  const added = after.dishes.filter((d) => !before.dishes.includes(d));
  if (removed.length || added.length) {
    out.push({
      field: 'dishes',
      label: 'Dishes',
      from: listText(before.dishes),
      to: [added.length ? `adds ${added.join(', ')}` : '', removed.length ? `drops ${removed.join(', ')}` : ''].filter(Boolean).join('; '),
    });
  }
  const pct = (v: number | null) => (v === null ? 'not a number' : `${v} %`);
  add('targetAvailabilityPercent', 'Target availability', pct(before.targetAvailabilityPercent), pct(after.targetAvailabilityPercent));
  add('title', 'Title', before.title, after.title.trim() === '' ? 'the default title' : after.title.trim());
  return out;
}
