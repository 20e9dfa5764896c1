/**
 * Writes the renderers' golden files: `npx tsx tests/shared/render/update-golden.ts`.
 * Review the diff (and look at a PNG of a changed SVG) before committing.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { GOLDEN_DIR, goldenCases } from './golden-cases.ts';

mkdirSync(GOLDEN_DIR, { recursive: true });
for (const c of goldenCases()) {
  writeFileSync(join(GOLDEN_DIR, c.file), c.make(), 'utf8');
  process.stdout.write(`wrote ${c.file}\n`);
}
