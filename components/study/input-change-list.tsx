'use client';

import { useEffect, useRef, useState } from 'react';
import { MAPS_CLIMATE_VALUE, TARGET_AVAILABILITY_PERCENT } from '@/server/validation/study';
import { studyInputChanges, type StudyChoiceView } from '@/server/studies/input-changes';
import type { NewStudyOptions, StudyEdit } from './new-study-form';

/** The form's current choices in the same words as the stored study's (names from the same options). */
function choicesOf(form: HTMLFormElement, options: NewStudyOptions): StudyChoiceView {
  const data = new FormData(form);
  const text = (name: string) => String(data.get(name) ?? '').trim();
  const ids = (name: string) => data.getAll(name).map(String);
  const newCustomer = text('customerMode') === 'new';
  const newSite = newCustomer || text('siteMode') === 'new';
  const nameOf = <T extends { id: number; name: string }>(list: T[], id: string) => list.find((x) => String(x.id) === id)?.name ?? (id ? `#${id}` : 'none');
  const target = text('targetAvailabilityPercent');
  return {
    customer: newCustomer ? `${text('newCustomerName') || 'a new customer'} (new)` : nameOf(options.customers, text('customerId')),
    site: newSite ? `${text('siteName') || 'a new site'} (new, ${text('latDeg') || '?'}, ${text('lonDeg') || '?'})` : nameOf(options.sites, text('siteId')),
    services: [text('serviceProfileId'), ...ids('compareServiceProfileIds')].filter(Boolean).map((id) => nameOf(options.services, id)),
    climate: [MAPS_CLIMATE_VALUE, ''].includes(text('climateProfileId')) ? options.mapsName : nameOf(options.climates, text('climateProfileId')),
    dishes: options.dishes.filter((d) => ids('dishIds').includes(String(d.id))).map((d) => d.name),
    // Blank is the default target, as the schema reads it.
    targetAvailabilityPercent: target === '' ? TARGET_AVAILABILITY_PERCENT.default : /^\d+(\.\d+)?$/.test(target) ? Number(target) : null,
    title: text('title'),
  };
}

/**
 * Under the edit form: every input that differs from the stored study, old → new, kept up to date
 * while the installer edits, so the save button makes no surprise.
 */
export function InputChangeList({ edit, options }: { edit: StudyEdit; options: NewStudyOptions }) {
  const ref = useRef<HTMLDivElement>(null);
  const [after, setAfter] = useState<StudyChoiceView>(edit.before);
  useEffect(() => {
    const form = ref.current?.closest('form');
    if (!form) return;
    const read = () => setAfter(choicesOf(form, options));
    read();
    form.addEventListener('input', read);
    form.addEventListener('change', read);
    return () => {
      form.removeEventListener('input', read);
      form.removeEventListener('change', read);
    };
  }, [options]);
  const changes = studyInputChanges(edit.before, after);
  return (
    <section ref={ref} aria-labelledby="changes-title" aria-live="polite" className="rounded-md border border-ledger-200 bg-ledger-50/50 px-4 py-3">
      <h2 id="changes-title" className="text-base font-semibold text-stone-900">
        Changes from revision {edit.fromRevision}
      </h2>
      {changes.length === 0 ? (
        <p className="mt-1 text-sm text-stone-700">
          No input changed. Saving still makes revision {edit.nextRevision} with today&rsquo;s service profile, dish prices, climate data and engine.
        </p>
      ) : (
        <ul className="mt-2 space-y-1 text-sm text-stone-800" aria-label="Changed inputs">
          {changes.map((c) => (
            <li key={c.field}>
              <strong>{c.label}:</strong> <span className="text-stone-600">{c.from}</span> <span aria-hidden="true">→</span>
              <span className="sr-only">becomes</span> <span className="font-medium text-stone-900">{c.to}</span>
            </li>
          ))}
        </ul>
      )}
      <p className="mt-2 text-xs text-stone-600">The saved revision keeps its own copy of the inputs; the earlier revision and any quote made from it stay exactly as they are.</p>
    </section>
  );
}
