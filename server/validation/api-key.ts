import { z } from 'zod';
import { API_SCOPES } from '@/server/auth/api-scopes';

/** Requests a key may make per minute unless the admin chooses otherwise. */
export const DEFAULT_API_KEY_RATE_PER_MINUTE = 120;
export const MAX_API_KEY_RATE_PER_MINUTE = 600;

/** The new-key form (settings/api-keys) and the createApiKey action. */
export const createApiKeySchema = z.object({
  name: z.string().trim().min(1, 'Give the key a name, e.g. the system that will use it.').max(80, 'At most 80 characters.'),
  // A form sends one checkbox value as a string and several as an array.
  scopes: z.preprocess(
    (v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v : [v]),
    z.array(z.enum(API_SCOPES, { error: `A scope is one of ${API_SCOPES.join(', ')}.` })).min(1, 'Choose at least one scope.'),
  ).transform((s) => API_SCOPES.filter((scope) => s.includes(scope))),
  rateLimitPerMinute: z.preprocess(
    (v) => (v === undefined || v === '' ? DEFAULT_API_KEY_RATE_PER_MINUTE : v),
    z.coerce.number({ error: 'A whole number of requests a minute.' }).int('A whole number of requests a minute.').min(1, 'At least 1 a minute.').max(MAX_API_KEY_RATE_PER_MINUTE, `At most ${MAX_API_KEY_RATE_PER_MINUTE} a minute.`),
  ),
});
export type CreateApiKeyInput = z.output<typeof createApiKeySchema>;

export const revokeApiKeySchema = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647) });
