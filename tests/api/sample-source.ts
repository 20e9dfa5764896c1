/**
 * A pattern source for API tests: the first demo example when one exists
 * (examples/*.loop), else a short text. The API tests check storage and
 * access, not the notation, so any text works; a marker makes versions differ.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

const examplesDir = path.resolve(import.meta.dirname, '..', '..', 'examples');

function firstExample(): string {
  try {
    const file = readdirSync(examplesDir).filter((f) => f.endsWith('.loop')).sort()[0];
    if (file) return readFileSync(path.join(examplesDir, file), 'utf8');
  } catch {
    // no examples yet
  }
  return 'cast on 8\n';
}

const base = firstExample();

/** The sample source, with `# marker` appended when given. */
export function sampleSource(marker?: string): string {
  return marker ? `${base.replace(/\n*$/, '\n')}# ${marker}\n` : base;
}
