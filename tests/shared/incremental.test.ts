/**
 * The incremental compiler (shared/incremental.ts) must give exactly what a
 * fresh `compile` gives, whatever it reuses: fast-check over sequences of
 * edits to the demo patterns (typing a stitch, a note, a comment, a line
 * break, deleting a stretch, duplicating or swapping lines, garbage), each
 * result compared as JSON with a fresh compile of the same text (contracts.md:
 * `compile` is deterministic; the incremental one must be indistinguishable).
 * No timing here: speed is the bench's business (rules.md).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';
import { createIncrementalCompiler } from '../../shared/incremental.ts';
import { parseSource } from '../../shared/notation/index.ts';
import { editPatternSource } from '../bench/edit-pattern.ts';

const root = path.resolve(import.meta.dirname, '..', '..');
const demos = ['lantern-mitts', 'tidepool-cowl', 'quarry-tote-panel'].map((n) => readFileSync(path.join(root, 'examples', `${n}.loop`), 'utf8'));

/** What a designer might type or delete. */
type Edit =
  | { kind: 'insert'; at: number; text: string }
  | { kind: 'delete'; at: number; length: number }
  | { kind: 'duplicate-line' | 'drop-line'; line: number }
  | { kind: 'swap-lines'; a: number; b: number };

const snippets = [
  'k', ' k 2, ', 'p2', ', k2tog', ' ssk', 'm1l in B, ', '\n', '\n\n', '# a comment\n', ' # side note', ' note "try it on"', 'x', '7', '/',
  'round 60: k to end\n', 'rounds 3-4 at back: p to end\n', ':', '(', ')', '"', '@@', ' to end', ' in A', 'chart ', 'ladder B every 4 from round 2 to 6\n',
];

const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant('insert' as const), at: fc.nat(), text: fc.constantFrom(...snippets) }),
  fc.record({ kind: fc.constant('delete' as const), at: fc.nat(), length: fc.integer({ min: 1, max: 12 }) }),
  fc.record({ kind: fc.constantFrom('duplicate-line' as const, 'drop-line' as const), line: fc.nat() }),
  fc.record({ kind: fc.constant('swap-lines' as const), a: fc.nat(), b: fc.nat() }),
);

function apply(source: string, e: Edit): string {
  if (e.kind === 'insert') { const at = e.at % (source.length + 1); return source.slice(0, at) + e.text + source.slice(at); }
  if (e.kind === 'delete') { const at = e.at % (source.length + 1); return source.slice(0, at) + source.slice(at + e.length); }
  const lines = source.split('\n');
  if (e.kind === 'swap-lines') {
    const a = e.a % lines.length, b = e.b % lines.length;
    [lines[a], lines[b]] = [lines[b], lines[a]];
  } else {
    const i = e.line % lines.length;
    if (e.kind === 'duplicate-line') lines.splice(i, 0, lines[i]); else lines.splice(i, 1);
  }
  return lines.join('\n');
}

const json = (v: unknown) => JSON.stringify(v);
// LW_INCREMENTAL_RUNS=2000 npx vitest run tests/shared/incremental.test.ts: a longer search.

describe('incremental compiler', () => {
  it('gives the same JSON as a fresh compile after every edit of a demo pattern (fast-check, 80 edit sequences)', () => {
    fc.assert(
      fc.property(fc.nat({ max: demos.length - 1 }), fc.array(edit, { minLength: 1, maxLength: 4 }), fc.option(fc.constantFrom('S', 'M', 'L', 'one'), { nil: undefined }), (d, edits, size) => {
        const inc = createIncrementalCompiler();
        let source = demos[d];
        expect(json(inc.compile(source, { size }))).toBe(json(compile(source, { size })));
        for (const e of edits) {
          source = apply(source, e);
          expect(json(inc.compile(source, { size }))).toBe(json(compile(source, { size })));
        }
      }),
      { numRuns: Number(process.env.LW_INCREMENTAL_RUNS ?? 80) },
    );
  }, 600_000);

  it('reuses every statement and the whole check when only a comment changes in place, and the result is still the fresh one', () => {
    const inc = createIncrementalCompiler();
    const source = demos[0];
    inc.compile(source);
    const edited = source.replace('# Split the round', '# SPLIT the round');
    expect(edited).not.toBe(source);
    const result = inc.compile(edited);
    expect(inc.lastStats.reusedCheck).toBe(true);
    expect(inc.lastStats.reusedPieces).toBe(inc.lastStats.pieces);
    expect(json(result)).toBe(json(compile(edited)));
  });

  it('re-parses only the edited statement after a one-round edit that moves later text, and works the sizes again', () => {
    const inc = createIncrementalCompiler();
    const source = demos[0];
    inc.compile(source);
    const edited = source.replace('rounds 51-56: (k2, p2) to end in A', 'rounds 51-56: (k2, p2) to end in A note "cuff"');
    expect(edited).not.toBe(source);
    const result = inc.compile(edited);
    expect(inc.lastStats.pieces - inc.lastStats.reusedPieces).toBe(1);
    expect(inc.lastStats.reusedCheck).toBe(false);
    expect(json(result)).toBe(json(compile(edited)));
  });

  it('takes the rounds before and after a one-round edit from the previous check, and the result is still the fresh one', () => {
    const inc = createIncrementalCompiler();
    const source = demos[0];
    inc.compile(source);
    const edited = source.replace('rounds 51-56: (k2, p2) to end in A', 'rounds 51-56: (k2, p2) to end in A note "cuff"');
    const result = inc.compile(edited);
    // The note changes nothing the rounds do: every round but the edited line's is taken over.
    expect(inc.lastStats.reusedRounds).toBeGreaterThan(inc.lastStats.workedRounds);
    expect(json(result)).toBe(json(compile(edited)));
  });

  it('gives the fresh JSON after edits inside round lines, where earlier rounds and later rounds are taken over (fast-check, 120 edit sequences)', () => {
    // Round-line edits a designer makes: change a stitch, a count, a yarn, add a note,
    // drop or repeat an operation, renumber, duplicate or drop the line.
    const bases = [...demos, editPatternSource()];
    const roundEdit = fc.record({
      line: fc.nat(),
      how: fc.constantFrom('k->p', 'p->k', 'count+1', 'count-1', 'note', 'drop-op', 'repeat-op', 'renumber', 'duplicate', 'drop', 'yarn', 'ssk', 'garbage'),
    });
    const edited = (source: string, e: { line: number; how: string }): string => {
      const lines = source.split('\n');
      const rounds = lines.map((l, i) => ({ l, i })).filter(({ l }) => /^(rounds?|rows?) \d/.test(l));
      if (rounds.length === 0) return source;
      const { l, i } = rounds[e.line % rounds.length];
      let n = l;
      switch (e.how) {
        case 'k->p': n = l.replace(/\bk(\s?\d)/, 'p$1'); break;
        case 'p->k': n = l.replace(/\bp(\s?\d)/, 'k$1'); break;
        case 'count+1': n = l.replace(/(\d+)(?!.*\d)/, (d) => String(Number(d) + 1)); break;
        case 'count-1': n = l.replace(/(\d+)(?!.*\d)/, (d) => String(Math.max(0, Number(d) - 1))); break;
        case 'note': n = l.includes(' note ') ? l.replace(/ note "[^"]*"/, '') : `${l} note "try it on"`; break;
        case 'drop-op': n = l.replace(/, [^,]*$/, ''); break;
        case 'repeat-op': n = l.replace(/: ([^,]*)/, ': $1, $1'); break;
        case 'renumber': n = l.replace(/^(rounds?|rows?) (\d+)/, (_m, w: string, d: string) => `${w} ${Number(d) + 1}`); break;
        case 'yarn': n = l.includes(' in ') ? l.replace(/ in [AB]\b/, ' in B') : `${l} in B`; break;
        case 'ssk': n = l.replace('k2tog', 'ssk'); break;
        case 'garbage': n = `${l} @@`; break;
      }
      if (e.how === 'duplicate') lines.splice(i, 0, l);
      else if (e.how === 'drop') lines.splice(i, 1);
      else lines[i] = n;
      return lines.join('\n');
    };
    let resumed = 0, carried = 0, patched = 0;
    fc.assert(
      fc.property(fc.nat({ max: bases.length - 1 }), fc.array(roundEdit, { minLength: 1, maxLength: 3 }), fc.option(fc.constantFrom('S', 'M', 'L'), { nil: undefined }), (d, edits, size) => {
        const inc = createIncrementalCompiler();
        let source = bases[d];
        inc.compile(source, { size });
        for (const e of edits) {
          source = edited(source, e);
          expect(json(inc.compile(source, { size }))).toBe(json(compile(source, { size })));
          if (inc.lastStats.reusedRounds > 0) resumed++;
          if (inc.lastStats.carriedPlans > 0) carried++;
          if (inc.lastStats.patchedAst) patched++;
        }
      }),
      { numRuns: Number(process.env.LW_INCREMENTAL_RUNS ?? 120) },
    );
    // The property is only worth something if the resuming path ran, with plans carried over and planned again.
    expect(resumed).toBeGreaterThan(20);
    expect(carried).toBeGreaterThan(10);
    expect(carried).toBeLessThan(resumed);
    expect(patched).toBeGreaterThan(10);
  }, 600_000);

  it('moves reused statements after an edit that adds lines above them (spans and line numbers as a fresh compile)', () => {
    const inc = createIncrementalCompiler();
    const source = demos[1];
    inc.compile(source);
    const edited = source.replace('\n', '\n# one\n# two\n');
    const result = inc.compile(edited);
    expect(inc.lastStats.reusedPieces).toBe(inc.lastStats.pieces);
    expect(json(result)).toBe(json(compile(edited)));
  });

  it('makes the long-float warnings afresh when the gauge changes, though the lines they point at are the same', () => {
    const inc = createIncrementalCompiler();
    const source = editPatternSource();
    const before = inc.compile(source).diagnostics.filter((d) => d.code === 'LW501');
    expect(before.length).toBeGreaterThan(10);
    const edited = source.replace('gauge 28 sts and 32 rounds per 10 cm', 'gauge 22 sts and 32 rounds per 10 cm');
    expect(edited).not.toBe(source);
    const after = inc.compile(edited);
    expect(json(after)).toBe(json(compile(edited)));
    // Same places, other lengths in inches: facts kept from the earlier compile would say otherwise.
    const messages = after.diagnostics.filter((d) => d.code === 'LW501').map((d) => d.message);
    expect(messages).not.toEqual(before.map((d) => d.message));
    // And back: the warnings are the first compile's again.
    expect(json(inc.compile(source))).toBe(json(compile(source)));
  });

  it('builds the AST anew when an edited round line also changed places with its neighbour', () => {
    const inc = createIncrementalCompiler();
    const source = editPatternSource();
    inc.compile(source);
    const a = 'round 150 at front in A: (k 2, catch B) to end\n', b = 'round 151 at front in A: (k 2, catch B) to end\n';
    expect(source).toContain(a + b);
    const edited = source.replace(a + b, b.replace('(k 2', '(p 2') + a);
    expect(json(inc.compile(edited))).toBe(json(compile(edited)));
    // A plain one-line edit is patched into the previous AST.
    const plain = 'round 153 at front in A: (k 2, catch B) to end';
    expect(edited).toContain(plain);
    const again = edited.replace(plain, 'round 153 at front in A: (k 1, p 1, catch B) to end');
    expect(json(inc.compile(again))).toBe(json(compile(again)));
    expect(inc.lastStats.patchedAst).toBe(true);
  });

  it('builds round and ladder lines that share no span object (a moved line shifts each of its spans in place, once)', () => {
    const spansOf = (v: unknown, into: object[]): void => {
      if (v === null || typeof v !== 'object') return;
      if ('from' in v && 'to' in v && 'line' in v && 'column' in v) { into.push(v); return; }
      for (const [k, x] of Object.entries(v)) if (k !== 'stitch') spansOf(x, into);
    };
    let lines = 0;
    for (const source of [...demos, editPatternSource()]) {
      const { ast } = parseSource(source);
      for (const line of [...ast.rounds, ...ast.ladders]) {
        const spans: object[] = [];
        spansOf(line, spans);
        expect(new Set(spans).size).toBe(spans.length);
        lines++;
      }
    }
    expect(lines).toBeGreaterThan(300);
  });

  it('keeps a moved round line and the ladder lines the same objects, their spans where a fresh compile puts them', () => {
    const inc = createIncrementalCompiler();
    const source = editPatternSource();
    const first = inc.compile(source);
    // The last round's line comes after the edited one; the ladders come before the front's rounds.
    const line = first.sizes[0].stitches.rounds[299].span;
    const from = line.from;
    const ladder = first.sizes[0].stitches.sources.find((s) => source.slice(s.from, s.to).startsWith('ladder'))!;
    const edited = source.replace('round 150 at front in A: (k 2, catch B) to end', 'round 150 at front in A: (k 1, p 1, catch B) to end');
    const fresh = compile(edited);
    const again = inc.compile(edited);
    // The same span object, moved by the five characters the edit added.
    expect(again.sizes[0].stitches.rounds[299].span).toBe(line);
    expect(line.from).toBe(from + 5);
    expect(line).toEqual(fresh.sizes[0].stitches.rounds[299].span);
    expect(again.sizes[0].stitches.sources).toContain(ladder);
    expect(json(again)).toBe(json(fresh));
  });
});
