/**
 * Writes fixtures/site-maps-callers.json: what the three map readers gave before they shared one
 * function. Run once on the old code (`npx tsx tests/unit/studies/capture-site-maps-callers.ts`);
 * running it again after a change would only copy the change into the fixture.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { allCallers } from './site-maps-callers';

const file = join(__dirname, 'fixtures', 'site-maps-callers.json');
writeFileSync(file, `${JSON.stringify(allCallers())}\n`);
console.log(`wrote ${file}`);
