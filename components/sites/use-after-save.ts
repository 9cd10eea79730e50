'use client';

import { useEffect, useRef } from 'react';
import { useSWRConfig } from 'swr';
import type { ActionState } from '@/server/actions/safe-action';

/**
 * After the server accepts a change: refetch every SWR list under `listPrefix` (the lists are
 * fetched in the client, so revalidatePath alone does not refresh them), then run `onSaved`.
 * Runs once per answer, not on every render.
 */
export function useAfterSave(state: ActionState<unknown> | null, listPrefix: string, onSaved?: () => void): void {
  const { mutate } = useSWRConfig();
  const handled = useRef(state);
  useEffect(() => {
    if (state === handled.current) return;
    handled.current = state;
    if (!state?.ok) return;
    void mutate((key) => typeof key === 'string' && key.startsWith(listPrefix));
    onSaved?.();
  }, [state, listPrefix, mutate, onSaved]);
}
