/** Small helpers for compiler tests: read fixtures, compile, list codes. */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { compile, type CompileResult } from '../../shared/index.ts';

export const root = path.resolve(import.meta.dirname, '..', '..');
export const brokenDir = path.join(root, 'examples', 'broken');
export const examplesDir = path.join(root, 'examples');

/** The broken fixtures: file name, the code it shows (from the name), its source. */
export function brokenFixtures(): { file: string; code: string; source: string }[] {
  return readdirSync(brokenDir)
    .filter((f) => f.endsWith('.loop'))
    .sort()
    .map((file) => ({ file, code: file.slice(0, 5).toUpperCase(), source: readFileSync(path.join(brokenDir, file), 'utf8') }));
}

/** The demo patterns. */
export function examples(): { file: string; source: string }[] {
  return readdirSync(examplesDir)
    .filter((f) => f.endsWith('.loop'))
    .sort()
    .map((file) => ({ file, source: readFileSync(path.join(examplesDir, file), 'utf8') }));
}

/** Compiles, honouring a "# check with --size NAME" line in the source. */
export function compileFixture(source: string): CompileResult {
  const m = /^# check with --size (\S+)/m.exec(source);
  return compile(source, m ? { size: m[1] } : {});
}

/** A minimal pattern around some round lines (one size, gauge 28 sts / 10 cm, yarns A and B). */
export function pattern(body: string, castOn = 40, extra = ''): string {
  return [
    'title "Test"',
    'gauge 28 sts and 32 rounds per 10 cm',
    'yarn A "Harbour" #1d3557',
    'yarn B "Sea Foam" #cfe8e0',
    extra,
    `cast on ${castOn}`,
    body,
  ].join('\n');
}

/** Codes of a result's diagnostics, sorted, without duplicates. */
export function codes(r: CompileResult): string[] {
  return [...new Set(r.diagnostics.map((d) => d.code))].sort();
}

/** Counts of the rounds of the only (or first) size: front+backing per round. */
export function counts(r: CompileResult): string[] {
  return r.sizes[0].rounds.map((x) => (x.backing ? `${x.front}+${x.backing}` : String(x.front)));
}
