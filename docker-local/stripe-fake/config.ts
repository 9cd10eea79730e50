// Settings from the environment, checked up front so a wrong value stops the fake with a clear
// message instead of failing later at the first webhook.
export interface FakeConfig {
  /** 0 picks a free port (tests). */
  port: number;
  /** The only API key accepted; any other gets Stripe's 401, as a key of another account would. */
  secretKey: string;
  webhookSecret: string;
  /** Where events are POSTed; null records them without delivery. */
  webhookUrl: string | null;
  /** Base URL of the hosted pages as a browser reaches them; null → http://127.0.0.1:<port>. */
  publicUrl: string | null;
  retryDelaysMs: number[];
  webhookTimeoutMs: number;
}

export class ConfigError extends Error {}

function httpUrl(name: string, value: string): string {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw new ConfigError(`${name} must be an absolute http(s) URL, got "${value}".`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    throw new ConfigError(`${name} must use http or https, got "${value}".`);
  }
  return value.replace(/\/+$/, '');
}

export function readConfig(env: Record<string, string | undefined>): FakeConfig {
  const rawPort = env.STRIPE_FAKE_PORT?.trim() || '12111';
  if (!/^\d+$/.test(rawPort) || Number(rawPort) > 65535) {
    throw new ConfigError(`STRIPE_FAKE_PORT must be a port number (0-65535), got "${rawPort}".`);
  }
  // The same variable the app reads, so the app and the fake cannot disagree by accident; a
  // live-mode key is refused outright because this stand-in is for test mode only.
  const secretKey = env.STRIPE_SECRET_KEY?.trim() ?? '';
  if (!/^(sk|rk)_test_\S{4,}$/.test(secretKey)) {
    throw new ConfigError('STRIPE_SECRET_KEY is required and must be a test-mode key like "sk_test_..." (the key the app uses; only it is accepted).');
  }
  const secret = env.STRIPE_WEBHOOK_SECRET?.trim() ?? '';
  if (!/^whsec_\S{8,}$/.test(secret)) {
    throw new ConfigError('STRIPE_WEBHOOK_SECRET is required and must look like "whsec_..." (at least 8 characters after the prefix).');
  }
  const webhookUrl = env.STRIPE_FAKE_WEBHOOK_URL?.trim();
  const publicUrl = env.STRIPE_FAKE_PUBLIC_URL?.trim();
  return {
    port: Number(rawPort),
    secretKey,
    webhookSecret: secret,
    webhookUrl: webhookUrl ? httpUrl('STRIPE_FAKE_WEBHOOK_URL', webhookUrl) : null,
    publicUrl: publicUrl ? httpUrl('STRIPE_FAKE_PUBLIC_URL', publicUrl) : null,
    // About 6 s of retries in all: enough to ride out an app restart, short for tests.
    retryDelaysMs: [250, 1000, 4000],
    webhookTimeoutMs: 10_000,
  };
}
