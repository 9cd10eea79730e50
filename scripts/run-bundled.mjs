/**
 * `node [--conditions=react-server] scripts/run-bundled.mjs <entry.ts> [args…]`: bundles one
 * TypeScript entry with esbuild here and now, then runs it in this process. The campaign worker
 * (server/campaigns/worker-main.ts: `npm run worker`, `npm start`, the tests) and the engine part
 * of `npm run bench:campaign` run this way rather than through tsx. Why: tsx compiles with
 * esbuild's keepNames, which wraps every function created at run time in a naming call; the engine
 * creates small closures per site and dish, and under tsx a campaign ran about twice as slowly
 * (the benchmark prints both). The Next.js app is compiled by Next and never had that cost.
 *
 * Packages stay outside the bundle and resolve from node_modules as usual. Several processes may
 * start at once: each writes its own file and renames it into place, so none reads a half-written
 * bundle.
 */
import { build } from 'esbuild';
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const [entry, ...rest] = process.argv.slice(2);
if (!entry) {
  console.error('usage: node scripts/run-bundled.mjs <entry.ts> [args…]');
  process.exit(2);
}
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const outDir = path.join(root, '.local', 'build');
const out = path.join(outDir, `${path.basename(entry).replace(/\.[cm]?tsx?$/, '')}.cjs`);
fs.mkdirSync(outDir, { recursive: true });

const result = await build({
  absWorkingDir: root,
  entryPoints: [entry],
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
// The entry sees its own arguments as if started directly: argv[1] is the bundle.
process.argv = [process.argv[0], out, ...rest];
createRequire(import.meta.url)(out);
