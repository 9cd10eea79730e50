import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The company row lock is taken in one place (db/queries/company-lock.ts) and plan limits are
 * checked through assertWithinPlan, which asks for that lock. A new copy of the lock statement or
 * a direct call of the billing function from elsewhere fails here.
 */
const ROOT = path.resolve(__dirname, '../../..');
const SOURCE_DIRS = ['app', 'components', 'db', 'server'];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name === 'node_modules' ? [] : sourceFiles(full);
    return /\.(ts|tsx)$/.test(name) ? [full] : [];
  });
}

const files = SOURCE_DIRS.flatMap((d) => sourceFiles(path.join(ROOT, d))).map((f) => ({ file: path.relative(ROOT, f), text: readFileSync(f, 'utf8') }));

describe('one company lock', () => {
  it('the company row is locked FOR UPDATE only by lockCompanyRow', () => {
    const lockers = files.filter((f) => /FROM companies[^'"`]*FOR UPDATE/.test(f.text)).map((f) => f.file);
    expect(lockers).toEqual(['db/queries/company-lock.ts']);
  });
  it('the plan-limit check takes the lock token, so it cannot run without the lock', () => {
    const checker = files.find((f) => f.file === 'server/plan-limit.ts');
    expect(checker?.text).toMatch(/export async function assertWithinPlan\(lock: CompanyLock,/);
    const otherChecks = files.filter((f) => f.file !== 'server/plan-limit.ts' && /function assertWithin\w*\(/.test(f.text)).map((f) => f.file);
    expect(otherChecks).toEqual([]);
  });
});
