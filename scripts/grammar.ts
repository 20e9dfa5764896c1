/**
 * `npm run grammar`: writes the syntax diagrams of the Loopwright notation to
 * grammar/diagrams/, generated from the parser itself with chevrotain's
 * createSyntaxDiagramsCode. The page's scripts and styles are copied from
 * the chevrotain package next to it, so it opens offline (no CDN).
 */
import { copyFileSync, mkdirSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { createSyntaxDiagramsCode } from 'chevrotain';
import { getParser } from '../shared/notation/index.ts';

const root = path.resolve(import.meta.dirname, '..');
const out = path.join(root, 'grammar', 'diagrams');
const require = createRequire(import.meta.url);
// chevrotain does not export its package.json; find the diagrams folder from the main entry.
const entry = require.resolve('chevrotain');
const pkgDir = entry.slice(0, entry.lastIndexOf(`${path.sep}chevrotain${path.sep}`) + '/chevrotain'.length);
const assets = ['vendor/railroad-diagrams.js', 'src/diagrams_builder.js', 'src/diagrams_behavior.js', 'src/main.js', 'diagrams.css'];

mkdirSync(path.join(out, 'vendor'), { recursive: true });
mkdirSync(path.join(out, 'src'), { recursive: true });
for (const a of assets) copyFileSync(path.join(pkgDir, 'diagrams', a), path.join(out, a));

const grammar = getParser().getSerializedGastProductions();
const html = createSyntaxDiagramsCode(grammar, { resourceBase: './', css: './diagrams.css' })
  .replace('<meta charset="utf-8">', '<meta charset="utf-8">\n<title>Loopwright notation: syntax diagrams</title>');
writeFileSync(path.join(out, 'index.html'), html);
writeFileSync(path.join(out, 'grammar.json'), JSON.stringify(grammar, null, 2) + '\n');
console.log(`wrote ${path.relative(root, path.join(out, 'index.html'))} (${grammar.length} rules)`);
