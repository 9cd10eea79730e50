import { defineConfig } from 'vitest/config';
import path from 'node:path';

const alias = { '@': path.resolve(__dirname), 'server-only': path.resolve(__dirname, 'tests/support/server-only-noop.ts') };

// Two projects: `unit` is pure and needs nothing running; `integration` talks to the real
// MariaDB (and mail catcher / payment fake) that docker-local/test.sh starts before vitest.
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        // Pure tests share one module graph per worker: the ITU-R maps then gunzip once per worker
        // instead of once per file (each file loading them took 3–4 s).
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', isolate: false },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/integration/global-setup.ts'],
          setupFiles: ['tests/integration/setup-env.ts'],
          // One MariaDB database shared by every file: run files one after another.
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
