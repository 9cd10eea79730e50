import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** Where the maps live inside the repository, relative to its root. */
const DATA_FOLDER = path.join('server', 'climate-maps', 'data');
const CATALOGUE_FILE = 'maps.json';

let resolved: string | null = null;

/**
 * The folder holding maps.json and the *.f32.gz grids: `$FADELEDGER_MAPS_DIR` when set, else
 * `server/climate-maps/data` under the working directory, else found by walking up from this
 * module. Resolved once per process.
 *
 * @example
 * mapsDir() // => '/srv/fadeledger/server/climate-maps/data'
 */
export function mapsDir(): string {
  if (resolved) return resolved;
  const fromEnv = process.env.FADELEDGER_MAPS_DIR;
  // An explicit setting that points nowhere is a deployment mistake: say so rather than fall back.
  if (fromEnv) {
    if (!hasCatalogue(fromEnv)) throw new Error(`FADELEDGER_MAPS_DIR=${fromEnv} holds no ${CATALOGUE_FILE}`);
    return (resolved = fromEnv);
  }
  const fromCwd = path.join(process.cwd(), DATA_FOLDER);
  if (hasCatalogue(fromCwd)) return (resolved = fromCwd);
  const fromModule = walkUpFromModule();
  if (fromModule) return (resolved = fromModule);
  throw new Error(`ITU-R map data not found: set FADELEDGER_MAPS_DIR or run from the repository root (looked for ${fromCwd})`);
}

function hasCatalogue(dir: string): boolean {
  return fs.existsSync(path.join(dir, CATALOGUE_FILE));
}

// Bundlers and tsx's CommonJS mode each expose the module location differently (or not at all),
// so every way is tried and a failure only means "no answer from here".
function moduleDir(): string | null {
  try {
    if (typeof __dirname === 'string' && __dirname.length > 0) return __dirname;
  } catch {
    // __dirname is not defined in ES modules.
  }
  try {
    const url = import.meta.url;
    if (typeof url === 'string' && url.startsWith('file:')) return path.dirname(fileURLToPath(url));
  } catch {
    // import.meta is unavailable once compiled to CommonJS.
  }
  return null;
}

function walkUpFromModule(): string | null {
  let dir = moduleDir();
  for (let i = 0; dir && i < 8; i++) {
    for (const candidate of [path.join(dir, 'data'), path.join(dir, DATA_FOLDER)]) {
      if (hasCatalogue(candidate)) return candidate;
    }
    const parent = path.dirname(dir);
    if (parent === dir) break;
    dir = parent;
  }
  return null;
}
