/** Top-level fields whose value changed, with their old value: Stripe's `previous_attributes`. */
export function previousAttributes<T extends object>(before: T, after: T): Record<string, unknown> {
  const changed: Record<string, unknown> = {};
  for (const key of Object.keys(before) as (keyof T & string)[]) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) changed[key] = before[key];
  }
  return changed;
}
