import { z } from 'zod';

/**
 * The environment, parsed once with zod. A missing or malformed variable stops start-up with a
 * message naming it (instrumentation.ts calls getEnv() when the server boots).
 * Every variable is listed, with a comment, in .env.example.
 */
const port = z.coerce.number().int().min(1).max(65535);
const flag = z
  .enum(['true', 'false', '1', '0'])
  .transform((v) => v === 'true' || v === '1');

export const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  APP_URL: z.url({ message: 'must be an absolute URL such as http://localhost:3000' }),

  DATABASE_HOST: z.string().min(1),
  DATABASE_PORT: port,
  DATABASE_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only'),
  DATABASE_USER: z.string().min(1),
  DATABASE_PASSWORD: z.string().min(1),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),

  SMTP_HOST: z.string().min(1),
  SMTP_PORT: port,
  SMTP_SECURE: flag.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3),

  STRIPE_SECRET_KEY: z.string().regex(/^(sk|rk)_(test|live)_/, 'must start with sk_test_, sk_live_ or rk_…'),
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_/, 'must start with whsec_'),
  // Leave these three unset to talk to api.stripe.com; set them to reach a local Stripe-compatible server.
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: port.optional(),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).optional(),

  // 32 random bytes, base64 (e.g. `openssl rand -base64 32`): seals comparison-link tokens at rest
  // (AES-256-GCM) so a team member can copy a link again; look-ups still go by the token's sha256.
  SHARE_LINK_KEY: z
    .string()
    .refine((v) => /^[A-Za-z0-9+/_-]{43}=?$/.test(v) && Buffer.from(v, v.includes('-') || v.includes('_') ? 'base64url' : 'base64').length === 32, 'must be 32 random bytes in base64 (openssl rand -base64 32)'),
  // The campaign job queue (BullMQ). Every web process and worker points at the same Redis.
  REDIS_URL: z.string().regex(/^rediss?:\/\/[^\s]+$/, 'must be a redis:// or rediss:// URL such as redis://127.0.0.1:6380/0'),
  // Sites per chunk job of a campaign: smaller chunks spread better over workers, larger ones write fewer transactions.
  CAMPAIGN_CHUNK_SITES: z.coerce.number().int().min(10).max(20000).default(1000),
  // Chunks one worker process computes at a time (the engine is CPU-bound: 1 per core is right).
  CAMPAIGN_WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(16).default(1),
  // How long a worker holds a chunk without renewing its lock; a killed worker's chunk goes to another after this.
  CAMPAIGN_JOB_LOCK_SECONDS: z.coerce.number().int().min(2).max(600).default(30),
  // An upload still "receiving" with no batch written for this long is given up (its web process
  // died or the client vanished): marked failed, its staged rows deleted (server/campaigns/stale-uploads.ts).
  // A live upload writes a batch every second or so even over a slow link.
  CAMPAIGN_UPLOAD_STALE_SECONDS: z.coerce.number().int().min(5).max(86_400).default(600),
  // How often the workers look for such uploads (one BullMQ job scheduler shared by every worker).
  CAMPAIGN_UPKEEP_EVERY_SECONDS: z.coerce.number().int().min(1).max(3600).default(60),

  // Behind a load balancer, trust its X-Forwarded-For for throttling and the audit log.
  TRUST_PROXY: flag.default(false),

  // Encrypts the signing secrets of outbound webhook endpoints at rest: 32 random bytes as 64 hex
  // characters. Unset, webhooks cannot be registered (the rest of the app runs).
  WEBHOOK_SECRET_KEY: z.string().regex(/^[0-9a-fA-F]{64}$/, 'must be 64 hex characters (32 random bytes)').optional(),
  // Local testing only: lets webhooks go to http:// and to private, loopback and link-local addresses.
  WEBHOOKS_ALLOW_PRIVATE_TARGETS: flag.default(false),
  // How often each app process looks for due webhook deliveries; 0 turns the timer off in this process
  // (the test profile: integration tests deliver their own rows, "Send test event" still delivers at once).
  WEBHOOK_DELIVERY_INTERVAL_MS: z.coerce.number().int().min(0).max(3_600_000).default(5_000),
});

export type Env = z.infer<typeof envSchema>;

export class EnvError extends Error {
  constructor(public readonly problems: { variable: string; message: string }[]) {
    super(
      'FadeLedger cannot start: the environment is incomplete.\n' +
        problems.map((p) => `  ${p.variable}: ${p.message}`).join('\n') +
        '\nSee .env.example for every variable and what it means.',
    );
    this.name = 'EnvError';
  }
}

/** Parses a given environment (tests pass their own); throws EnvError naming each bad variable. */
export function parseEnv(source: Record<string, string | undefined>): Env {
  // Empty strings count as missing: a blank line in a .env file should not pass as a value.
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ''));
  const result = envSchema.safeParse(cleaned);
  if (!result.success) {
    throw new EnvError(
      result.error.issues.map((issue) => ({
        variable: String(issue.path[0] ?? '(unknown)'),
        message: issue.code === 'invalid_type' && issue.input === undefined ? 'is missing' : issue.message,
      })),
    );
  }
  return result.data;
}

let cached: Env | undefined;

/** The process environment, parsed on first use and then reused. */
export function getEnv(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}
