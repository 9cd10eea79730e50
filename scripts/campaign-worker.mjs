/**
 * Starts one campaign worker (server/campaigns/worker-main.ts) from a bundle esbuild makes here and
 * now, instead of through tsx. Why: tsx compiles with esbuild's keepNames, which wraps every
 * function created at run time in a naming call; the engine creates small closures per site and
 * dish, and under tsx a campaign ran about twice as slowly (measured: tests/bench/campaign.bench.ts).
 * The Next.js app is compiled by Next and never had that cost.
 *
 * Run as `node --conditions=react-server scripts/campaign-worker.mjs` (what `npm run worker`,
 * `npm start`, the tests and the benchmark do). Packages stay outside the bundle and resolve from
 * node_modules as usual. Several workers may start at once: each writes its own file first and
 * renames it into place, so none reads a half-written bundle.
 */
import { build } from 'esbuild';
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const outDir = path.join(root, '.local', 'build');
const out = path.join(outDir, 'campaign-worker.cjs');
fs.mkdirSync(outDir, { recursive: true });

const result = await build({
  absWorkingDir: root,
  entryPoints: ['server/campaigns/worker-main.ts'],
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  packages: 'external',
  tsconfig: 'tsconfig.json',
  sourcemap: 'inline',
  write: false,
  logLevel: 'warning',
});
const mine = `${out}.${process.pid}.tmp`;
fs.writeFileSync(mine, result.outputFiles[0].contents);
fs.renameSync(mine, out);
process.setSourceMapsEnabled(true);
createRequire(import.meta.url)(out);
