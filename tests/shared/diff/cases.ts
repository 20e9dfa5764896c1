// The golden cases of the diff: each a pair of small Loopwright sources in
// fixtures/<name>.old.loop and fixtures/<name>.new.loop (invented data from
// the Saltmarsh Knits demo scenario), with golden/<name>.json (the diff) and
// golden/<name>.txt (its plain-text rendering). Regenerate with
// `npx tsx tests/shared/diff/generate-golden.ts` and review the change like code.
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const HERE = dirname(fileURLToPath(import.meta.url));

export const CASES = [
  'changed-repeat', // a crown decrease repeat changed from (k 5, k2tog) to (k 12, k2tog)
  'added-gusset-round', // one more thumb-gusset increase round inserted after round 10
  'recoloured-cell', // one chart cell recoloured from B to A
  'moved-column', // a backing column of a flat panel moved from after stitch 12 to after stitch 15
  'header-change', // gauge, float limit, a size added, a yarn recoloured and relabelled
  'diagnostics', // a repeat fixed, an unknown yarn introduced, a float warning moved down a round
] as const;

export type CaseName = (typeof CASES)[number];

/** The two sources of a case. */
export function readCase(name: CaseName): { old: string; new: string } {
  return {
    old: readFileSync(join(HERE, 'fixtures', `${name}.old.loop`), 'utf8'),
    new: readFileSync(join(HERE, 'fixtures', `${name}.new.loop`), 'utf8'),
  };
}

export const goldenPath = (name: CaseName, ext: 'json' | 'txt') => join(HERE, 'golden', `${name}.${ext}`);
