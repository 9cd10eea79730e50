// Next.js calls register() once when a server instance boots: fail fast on a bad environment.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { getEnv } = await import('./server/env');
    try {
      getEnv();
    } catch (error) {
      console.error((error as Error).message);
      process.exit(1);
    }
    // Outbound webhooks: every app process delivers (claims are SKIP LOCKED rows in MariaDB).
    const { startWebhookDeliverer } = await import('./server/webhooks/deliverer');
    startWebhookDeliverer();
  }
}
