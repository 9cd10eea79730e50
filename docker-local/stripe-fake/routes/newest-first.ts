import type { Store } from '../state/store';

/** Stripe lists return the most recently created objects first. */
export function newestFirst<T extends { id: string }>(store: Store, items: Iterable<T>): T[] {
  return [...items].sort((a, b) => store.rank(b.id) - store.rank(a.id));
}
