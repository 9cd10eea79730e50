'use client';

import { useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { useFormState } from '@/components/ui/action-form';

/** Inside an ActionForm: after a successful answer carrying `data.id`, open that record (`base` + id). */
export function NavigateOnSuccess({ base = '/quotes/' }: { base?: string }) {
  const state = useFormState();
  const router = useRouter();
  useEffect(() => {
    const id = state?.ok ? (state.data as { id?: number } | undefined)?.id : undefined;
    if (id) router.push(`${base}${id}`);
  }, [state, router, base]);
  return null;
}
