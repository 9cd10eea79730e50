'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { createApiKey as create, revokeApiKey as revoke } from '@/server/auth/api-key-admin';
import { getRequestMeta } from '@/server/auth/request-meta';
import { createApiKeySchema, revokeApiKeySchema } from '@/server/validation/api-key';

const API_KEYS_PAGE = '/settings/api-keys';

/**
 * The key comes back in `data.token` this once, for the page to show with a copy button; it is
 * stored only as a sha256 digest and cannot be shown again.
 */
export const createApiKey = safeAction({ schema: createApiKeySchema, permission: 'apikey.manage' }, async (input, ctx) => {
  const key = await create(ctx, input, await getRequestMeta());
  revalidatePath(API_KEYS_PAGE);
  return { data: { token: key.token, prefix: key.prefix, name: input.name }, message: `API key “${input.name}” created. Copy it now: it is shown only this once.` };
});

export const revokeApiKey = safeAction({ schema: revokeApiKeySchema, permission: 'apikey.manage' }, async (input, ctx) => {
  const { name, alreadyRevoked } = await revoke(ctx, input.id, await getRequestMeta());
  revalidatePath(API_KEYS_PAGE);
  return { message: alreadyRevoked ? `API key “${name}” was already revoked.` : `API key “${name}” revoked: its next request is refused.` };
});
