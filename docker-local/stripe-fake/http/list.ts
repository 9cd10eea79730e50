// Stripe list envelope with cursor pagination (limit, starting_after, ending_before), newest first.
import type { ListObject } from '../objects/types';
import { StripeApiError } from './errors';
import type { Params } from './params';

export function listOf<T>(data: T[], url: string, hasMore = false): ListObject<T> {
  return { object: 'list', data, has_more: hasMore, url };
}

export function paginate<T extends { id: string }>(
  newestFirst: T[],
  params: Params,
  url: string,
): ListObject<T> {
  const limit = params.int('limit', 1, 100) ?? 10;
  const after = params.string('starting_after');
  const before = params.string('ending_before');
  if (after && before) {
    throw new StripeApiError(400, 'You may only specify one of these parameters: starting_after, ending_before.', {
      param: 'starting_after',
    });
  }
  const cursorIndex = (id: string, param: string): number => {
    const index = newestFirst.findIndex((item) => item.id === id);
    if (index < 0) {
      throw new StripeApiError(400, `Invalid ${param}: no object '${id}' in this list.`, { param, code: 'resource_missing' });
    }
    return index;
  };
  if (before) {
    const end = cursorIndex(before, 'ending_before');
    const start = Math.max(0, end - limit);
    return listOf(newestFirst.slice(start, end), url, start > 0);
  }
  const start = after ? cursorIndex(after, 'starting_after') + 1 : 0;
  const page = newestFirst.slice(start, start + limit);
  return listOf(page, url, start + limit < newestFirst.length);
}
