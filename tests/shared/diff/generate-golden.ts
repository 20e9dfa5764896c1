// Regenerates the golden files of the diff cases (see cases.ts):
//   npx tsx tests/shared/diff/generate-golden.ts
// Review the resulting git diff like code before committing it.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { diffRevisions, formatDiffText } from '../../../shared/diff/index.ts';
import { CASES, HERE, goldenPath, readCase } from './cases.ts';

mkdirSync(join(HERE, 'golden'), { recursive: true });
for (const name of CASES) {
  const src = readCase(name);
  const diff = diffRevisions(src.old, src.new);
  writeFileSync(goldenPath(name, 'json'), `${JSON.stringify(diff, null, 2)}\n`);
  writeFileSync(goldenPath(name, 'txt'), `${formatDiffText(diff, { cells: 1000 })}\n`);
  process.stdout.write(`${name}: ${diff.summary.roundsAdded} added, ${diff.summary.roundsRemoved} removed, ${diff.summary.roundsChanged} changed rounds\n`);
}
