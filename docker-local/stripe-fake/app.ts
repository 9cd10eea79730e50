// Builds and starts the fake: in-memory state, webhook dispatcher and msw handlers served over
// HTTP on loopback by @mswjs/http-middleware. Used by server.ts and directly by tests.
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createServer } from '@mswjs/http-middleware';
import Stripe from 'stripe';
import type { FakeConfig } from './config';
import type { FakeContext } from './context';
import { stripeFakeHandlers } from './handlers';
import { Store } from './state/store';
import { Dispatcher } from './webhooks/dispatcher';

export interface RunningFake {
  port: number;
  /** Base URL for the SDK host/port and the hosted pages. */
  url: string;
  ctx: FakeContext;
  close(): Promise<void>;
}

export const LOOPBACK = '127.0.0.1';

export async function startStripeFake(config: FakeConfig, log: (line: string) => void = (l) => console.error(`[stripe-fake] ${l}`)): Promise<RunningFake> {
  const store = new Store();
  const events = new Dispatcher({
    webhookUrl: config.webhookUrl,
    webhookSecret: config.webhookSecret,
    // Events carry the API version of the SDK the app uses, as its account default would be.
    apiVersion: Stripe.API_VERSION,
    retryDelaysMs: config.retryDelaysMs,
    timeoutMs: config.webhookTimeoutMs,
    log,
  });
  const ctx: FakeContext = { store, events, secretKey: config.secretKey, publicUrl: config.publicUrl ?? '', log };
  const app = createServer(...stripeFakeHandlers(ctx, { webhookUrl: config.webhookUrl, startedAt: Date.now() }));
  app.disable('x-powered-by');

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.port, LOOPBACK, () => resolve(s));
    s.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  const url = `http://${LOOPBACK}:${port}`;
  if (!config.publicUrl) ctx.publicUrl = url;

  return {
    port,
    url,
    ctx,
    close: () =>
      new Promise<void>((resolve) => {
        events.reset();
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
