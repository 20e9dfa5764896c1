/**
 * Mutated sources: a seed source (a demo pattern, a broken fixture or a
 * generated source) with one to five edits applied in order: byte and
 * token insertions, deletions of a stretch, swaps of two stretches or two
 * lines, line duplication, truncation, and replacement of a number by an
 * extreme one. Positions are drawn as plain integers and reduced modulo the
 * current length, so one edit list applies to any seed and shrinks well.
 */
import fc from 'fast-check';

/** Notation words and punctuation that make mutations land near the grammar. */
export const TOKENS = [
  'round', 'rounds', 'row', 'rows', ':', ',', '(', ')', '/', '-', '|', '"', '#', '\n', '\r\n', '\r', ' ', '\t',
  'k', 'p', 'k2tog', 'ssk', 'yo', 'm1l', 'cdd', 'kfb', 'to', 'end', 'last', 'marker', 'times', 'once', 'every', 'other', '3rd',
  'at', 'in', 'note', 'mark', 'unmark', 'chart', 'key', 'none', 'raise', 'carry', 'close', 'catch', 'cable', 'over', 'left',
  'ladder', 'from', 'columns', 'cast on', 'sizes', 'gauge', 'yarn', 'work flat', 'work in the round', 'float limit',
  '0', '1', '7', '99999999', '2147483648', '1e9', '-3', '0.5', 'A', 'B', 'Z', 'back', '"x"', '|..x|', '#1d3557', '#zzzzzz',
  '\u0000', '\uFEFF', '\u00e9', '\u{1F9F6}', '\uD800', '\u200B',
] as const;

/** One edit; positions are reduced modulo the source length when applied. */
export type Mutation =
  | { kind: 'insert-char'; at: number; char: string }
  | { kind: 'insert-token'; at: number; token: string }
  | { kind: 'delete'; at: number; length: number }
  | { kind: 'swap'; a: number; b: number; length: number }
  | { kind: 'swap-lines'; a: number; b: number }
  | { kind: 'duplicate-line'; line: number; times: number }
  | { kind: 'truncate'; at: number }
  | { kind: 'extreme-number'; nth: number; value: string };

const pos = fc.nat({ max: 1 << 20 });

/** An arbitrary edit. */
export const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('insert-char' as const), at: pos, char: fc.oneof(fc.string({ unit: 'binary', minLength: 1, maxLength: 1 }), fc.string({ unit: 'grapheme-ascii', minLength: 1, maxLength: 1 })) }) },
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('insert-token' as const), at: pos, token: fc.constantFrom(...TOKENS) }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('delete' as const), at: pos, length: fc.integer({ min: 1, max: 40 }) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('swap' as const), a: pos, b: pos, length: fc.integer({ min: 1, max: 30 }) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('swap-lines' as const), a: pos, b: pos }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('duplicate-line' as const), line: pos, times: fc.integer({ min: 1, max: 3 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('truncate' as const), at: pos }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('extreme-number' as const), nth: pos, value: fc.constantFrom('0', '99999999', '4294967297', '9007199254740993', '1000000', '00') }) },
);

const mod = (n: number, m: number) => (m <= 0 ? 0 : n % m);

/** Applies one edit to `s`. Pure; never throws. */
export function applyMutation(s: string, m: Mutation): string {
  switch (m.kind) {
    case 'insert-char': {
      const at = mod(m.at, s.length + 1);
      return s.slice(0, at) + m.char + s.slice(at);
    }
    case 'insert-token': {
      const at = mod(m.at, s.length + 1);
      return s.slice(0, at) + m.token + s.slice(at);
    }
    case 'delete': {
      const at = mod(m.at, s.length + 1);
      return s.slice(0, at) + s.slice(at + m.length);
    }
    case 'swap': {
      if (s.length < 2) return s;
      let a = mod(m.a, s.length), b = mod(m.b, s.length);
      if (a > b) [a, b] = [b, a];
      const len = Math.min(m.length, b - a, s.length - b);
      if (len <= 0) return s;
      return s.slice(0, a) + s.slice(b, b + len) + s.slice(a + len, b) + s.slice(a, a + len) + s.slice(b + len);
    }
    case 'swap-lines': {
      const lines = s.split('\n');
      const a = mod(m.a, lines.length), b = mod(m.b, lines.length);
      [lines[a], lines[b]] = [lines[b], lines[a]];
      return lines.join('\n');
    }
    case 'duplicate-line': {
      const lines = s.split('\n');
      const i = mod(m.line, lines.length);
      lines.splice(i, 0, ...Array<string>(m.times).fill(lines[i]));
      return lines.join('\n');
    }
    case 'truncate':
      return s.slice(0, mod(m.at, s.length + 1));
    case 'extreme-number': {
      const numbers = [...s.matchAll(/\d+/g)];
      if (numbers.length === 0) return s;
      const hit = numbers[mod(m.nth, numbers.length)];
      const at = hit.index ?? 0;
      return s.slice(0, at) + m.value + s.slice(at + hit[0].length);
    }
  }
}

/** A seed from `seeds` with 1 to `maxEdits` edits applied. */
export function mutatedFrom(seeds: fc.Arbitrary<string>, maxEdits = 5): fc.Arbitrary<string> {
  return fc.tuple(seeds, fc.array(mutation, { minLength: 1, maxLength: maxEdits })).map(([seed, edits]) => edits.reduce(applyMutation, seed));
}
