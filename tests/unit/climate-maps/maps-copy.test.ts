import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

/**
 * The repository carries its own copy of the ITU-R digital maps (server/climate-maps/data) so a
 * fresh clone computes the same figures. Where ../shared/itu-maps sits beside the clone, the copy
 * must equal it byte for byte; and maps.json must index exactly the grids the folder holds.
 */
const here = path.dirname(fileURLToPath(import.meta.url));
const PROJECT_COPY = path.resolve(here, '../../../server/climate-maps/data');

function sharedMapsDir(): string | null {
  let dir = here;
  for (let i = 0; i < 8; i++) {
    const candidate = path.join(dir, 'shared', 'itu-maps');
    if (fs.existsSync(path.join(candidate, 'README.md'))) return candidate;
    dir = path.dirname(dir);
  }
  return null;
}

const shared = sharedMapsDir();
const copied = fs.readdirSync(PROJECT_COPY).sort();

describe('the map copy in server/climate-maps/data', () => {
  it('maps.json lists exactly the grid files of the folder', () => {
    const catalogue = JSON.parse(fs.readFileSync(path.join(PROJECT_COPY, 'maps.json'), 'utf8')) as { maps: { file: string }[] };
    const listed = catalogue.maps.map((m) => m.file).sort();
    expect(new Set(listed).size, 'no file listed twice').toBe(listed.length);
    expect(listed).toEqual(copied.filter((f) => f !== 'maps.json' && f !== 'README.md'));
    expect(listed.every((f) => f.endsWith('.f32.gz'))).toBe(true);
  });

  it.skipIf(!shared)('equals ../shared/itu-maps byte for byte', () => {
    expect(fs.readdirSync(shared!).sort()).toEqual(copied);
    for (const f of copied) {
      const same = fs.readFileSync(path.join(PROJECT_COPY, f)).equals(fs.readFileSync(path.join(shared!, f)));
      expect(same, f).toBe(true);
    }
  });
});
