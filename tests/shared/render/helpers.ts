/** Small fixtures for the renderer tests. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { compile, type CompileResult } from '../../../shared/index.ts';

/** Reads a demo pattern from examples/. */
export function demo(name: string): { source: string; result: CompileResult } {
  const source = readFileSync(join(import.meta.dirname, '../../../examples', name), 'utf8');
  return { source, result: compile(source) };
}

/** Compiles a source written in a test. */
export function compiled(source: string): { source: string; result: CompileResult } {
  return { source, result: compile(source) };
}

/** A two-colour in-the-round header for small fixtures (28 sts / 10 cm: a 1 in limit is 7 sts). */
export const HEADER = [
  'title "Fixture"',
  'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Harbour" #1d3557',
  'yarn B "Sea Foam" #cfe8e0',
].join('\n');
