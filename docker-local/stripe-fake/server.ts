// Entry point: `npx tsx docker-local/stripe-fake/server.ts [--pid-file PATH]`.
// Env: STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET (required), STRIPE_FAKE_PORT (12111), STRIPE_FAKE_WEBHOOK_URL,
// STRIPE_FAKE_PUBLIC_URL, STRIPE_FAKE_PID_FILE. Writes nothing but the optional pid file.
import { unlinkSync, writeFileSync } from 'node:fs';
import { ConfigError, readConfig } from './config';
import { startStripeFake } from './app';

function pidFileArg(argv: string[]): string | null {
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--pid-file') return argv[i + 1] ?? null;
    if (argv[i].startsWith('--pid-file=')) return argv[i].slice('--pid-file='.length);
  }
  return process.env.STRIPE_FAKE_PID_FILE?.trim() || null;
}

async function main(): Promise<void> {
  let config;
  try {
    config = readConfig(process.env);
  } catch (error) {
    if (error instanceof ConfigError) {
      console.error(`[stripe-fake] ${error.message}`);
      process.exit(1);
    }
    throw error;
  }
  const fake = await startStripeFake(config);
  const pidFile = pidFileArg(process.argv.slice(2));
  if (pidFile) writeFileSync(pidFile, `${process.pid}\n`);

  console.log(`[stripe-fake] listening on ${fake.url} (pages at ${fake.ctx.publicUrl})`);
  console.log(`[stripe-fake] webhooks → ${config.webhookUrl ?? '(none: STRIPE_FAKE_WEBHOOK_URL not set, events are only recorded)'}`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[stripe-fake] ${signal}: stopping`);
    await fake.close();
    if (pidFile) {
      try {
        unlinkSync(pidFile);
      } catch {
        // Already removed by the caller.
      }
    }
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((error: unknown) => {
  const code = (error as NodeJS.ErrnoException).code;
  console.error(`[stripe-fake] failed to start${code === 'EADDRINUSE' ? ' (port already in use)' : ''}: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
