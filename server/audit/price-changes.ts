/**
 * The fields of a catalogue row that changed, as { from, to } pairs, for the audit log: a price
 * edit is the change an admin most often needs to trace, so prices are named even when equal
 * figures were retyped (then they are left out).
 */
export function priceChanges<T extends Record<string, string | number | null>>(before: T, after: T): Record<string, { from: T[keyof T]; to: T[keyof T] }> {
  const out: Record<string, { from: T[keyof T]; to: T[keyof T] }> = {};
  for (const key of Object.keys(after) as (keyof T & string)[]) {
    if (String(before[key]) !== String(after[key])) out[key] = { from: before[key], to: after[key] };
  }
  return out;
}
