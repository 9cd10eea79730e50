import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

/** The repository's verbatim copy of the shared reference figures (tests/fixtures/reference). */
export const REFERENCE_COPY_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../fixtures/reference');

/**
 * The shared reference folder `../shared/reference` beside the repository, found by walking up
 * from this file (so it works from any cwd), or null where the clone has none beside it.
 */
export function sharedReferenceDir(): string | null {
  let dir = path.dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 8; i++) {
    const candidate = path.join(dir, 'shared', 'reference');
    if (fs.existsSync(path.join(candidate, 'README.md'))) return candidate;
    dir = path.dirname(dir);
  }
  return null;
}

/** Where the published reference figures are read: $FADELEDGER_REFERENCE_DIR, the shared folder, else the copy. */
export function referenceDir(): string {
  return process.env.FADELEDGER_REFERENCE_DIR || sharedReferenceDir() || REFERENCE_COPY_DIR;
}

/** Read a reference CSV (plain comma-separated, header row, no quoting) as rows of strings. */
export function readReferenceCsv(fileName: string): Record<string, string>[] {
  const text = fs.readFileSync(path.join(referenceDir(), fileName), 'utf8');
  const lines = text.split(/\r?\n/).filter((l) => l.trim().length > 0);
  const header = lines[0].split(',').map((h) => h.trim());
  return lines.slice(1).map((line) => {
    const cells = line.split(',');
    if (cells.length !== header.length) throw new Error(`${fileName}: row "${line}" has ${cells.length} cells, header has ${header.length}`);
    return Object.fromEntries(header.map((h, i) => [h, cells[i].trim()]));
  });
}

/** Numeric cell. */
export function num(row: Record<string, string>, column: string): number {
  const v = Number(row[column]);
  if (row[column] === undefined || row[column] === '' || !Number.isFinite(v)) throw new Error(`column ${column} is not a number: ${row[column]}`);
  return v;
}

/** The relative tolerance every reference check demands (server/engine/README.md §6: 1e-4 or better). */
export const REFERENCE_RELATIVE_TOLERANCE = 1e-4;

/** |actual/expected − 1| ≤ tol (an expected 0 requires an exact 0). */
export function expectRelative(actual: number, expected: number, tol = REFERENCE_RELATIVE_TOLERANCE, label = ''): void {
  expect(Number.isFinite(actual), `${label} is finite`).toBe(true);
  if (expected === 0) {
    expect(actual, label).toBe(0);
    return;
  }
  const rel = Math.abs(actual / expected - 1);
  expect(rel, `${label}: got ${actual}, expected ${expected} (relative error ${rel.toExponential(2)})`).toBeLessThanOrEqual(tol);
}
