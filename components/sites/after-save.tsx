'use client';

import { useEffect, useRef } from 'react';
import { useSWRConfig } from 'swr';
import { useFormState } from '@/components/ui/action-form';

/**
 * Inside an ActionForm: after the server accepts a change, refetch every SWR list under
 * `listPrefix` (the lists are fetched in the client, so revalidatePath alone does not refresh
 * them), then run `onSaved`. Runs once per answer, not on every render.
 */
export function AfterSave({ listPrefix, onSaved }: { listPrefix: string; onSaved?: () => void }) {
  const state = useFormState();
  const { mutate } = useSWRConfig();
  const handled = useRef(state);
  useEffect(() => {
    if (state === handled.current) return;
    handled.current = state;
    if (!state?.ok) return;
    void mutate((key) => typeof key === 'string' && key.startsWith(listPrefix));
    onSaved?.();
  }, [state, listPrefix, mutate, onSaved]);
  return null;
}
