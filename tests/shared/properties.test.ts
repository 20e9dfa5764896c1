/**
 * Property tests (fast-check): the compiler never throws or hangs on any
 * string, every span stays inside the source and agrees with its line and
 * column, compiling is deterministic, and in every valid round the stitches
 * worked equal the stitches on the needle (conservation), with the counts
 * the trade's stitch arithmetic predicts.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compile, FLAG, highlightTokens, toCheckJson, type Span } from '../../shared/index.ts';
import { examples } from './fixtures.ts';

const words = [
  'round', 'rounds', 'row', 'rows', '1', '2', '3-9', '40', '99999999999', '/', ':', ',', '(', ')', 'k', 'p', 'k2tog', 'ssk', 'yo', 'm1l',
  'to', 'end', 'last', 'marker', 'times', 'once', 'every', '3rd', 'other', 'at', 'in', 'A', 'B', 'back', 'mark', 'unmark', 'chart',
  'wave', 'key', '"x"', '|.x|', 'none', 'raise', 'carry', 'close', 'catch', 'cable', 'over', 'left', 'ladder', 'from', 'columns',
  'cast', 'on', 'sizes', 'S', 'M', 'gauge', 'sts', 'and', 'per', '10', 'cm', 'yarn', '#1d3557', '"Harbour"', 'work', 'flat', 'the',
  'float', 'limit', 'note', '"hi"', '#', '\n', '@', '"', '-', 'bo', 'co', '2000000',
];
const soup = fc.array(fc.constantFrom(...words), { maxLength: 120 }).map((a) => a.join(' '));
const anyText = fc.oneof(fc.string({ maxLength: 300 }), fc.string({ unit: 'binary', maxLength: 300 }), soup, soup.map((s) => `yarn A "a" #123456\ncast on 12\n${s}`));

/** Line and column (1-based) of a UTF-16 offset; lines end at \n, \r\n or \r (as in CodeMirror). */
function position(source: string, offset: number): { line: number; column: number } {
  let line = 1, start = 0;
  for (let i = 0; i < offset; i++) {
    const c = source[i];
    if (c === '\n' || (c === '\r' && source[i + 1] !== '\n')) { line++; start = i + 1; }
  }
  return { line, column: offset - start + 1 };
}
function checkSpan(source: string, s: Span): void {
  expect(s.from).toBeGreaterThanOrEqual(0);
  expect(s.to).toBeGreaterThanOrEqual(s.from);
  expect(s.to).toBeLessThanOrEqual(source.length);
  expect(position(source, s.from)).toEqual({ line: s.line, column: s.column });
  expect(position(source, s.to)).toEqual({ line: s.endLine, column: s.endColumn });
}

describe('the compiler on any text', () => {
  it('never throws, and every diagnostic has a code, a message and a span inside the source', () => {
    fc.assert(
      fc.property(anyText, (source) => {
        const r = compile(source);
        for (const d of r.diagnostics) {
          expect(d.code).toMatch(/^LW\d{3}$/);
          expect(d.message.length).toBeGreaterThan(0);
          checkSpan(source, d.span);
          for (const rel of d.related ?? []) checkSpan(source, rel.span);
        }
        expect(r.ok).toBe(!r.diagnostics.some((d) => d.severity === 'error'));
      }),
      { numRuns: 400 },
    );
  });

  it('highlight tokens stay inside the source and do not overlap', () => {
    fc.assert(
      fc.property(anyText, (source) => {
        let end = 0;
        for (const t of highlightTokens(source)) {
          expect(t.from).toBeGreaterThanOrEqual(end);
          expect(t.to).toBeGreaterThan(t.from);
          expect(t.to).toBeLessThanOrEqual(source.length);
          end = t.to;
        }
      }),
      { numRuns: 300 },
    );
  });

  it('is deterministic: the same text gives the same result', () => {
    fc.assert(
      fc.property(anyText, (source) => {
        expect(toCheckJson(compile(source))).toEqual(toCheckJson(compile(source)));
      }),
      { numRuns: 150 },
    );
    for (const e of examples()) expect(toCheckJson(compile(e.source))).toEqual(toCheckJson(compile(e.source)));
  });

  it('finishes with coded diagnostics on huge counts instead of running away', () => {
    const cases = [
      'cast on 99999999999',
      'cast on 10\nrounds 1-99999999: k to end',
      'cast on 10\nround 1: (yo) 999999999 times, k to end',
      'cast on 10\nround 1: ((catch A) 999999 times) 999999 times, k to end',
      'cast on 10\nround 1: (m1l) to end',
    ];
    for (const c of cases) {
      const r = compile(`yarn A "a" #112233\n${c}`);
      expect(r.ok, c).toBe(false);
      expect(r.diagnostics.some((d) => d.code === 'LW901' || d.code === 'LW306'), c).toBe(true);
    }
  });
});

/** The net change of each generated operation, from the stitch arithmetic table (references.md). */
const moves: { text: string; takes: number; net: number }[] = [
  { text: 'k 3', takes: 3, net: 0 }, { text: 'p 2', takes: 2, net: 0 }, { text: 'k1 tbl', takes: 1, net: 0 },
  { text: 'sl1 wyif', takes: 1, net: 0 }, { text: 'yo', takes: 0, net: 1 }, { text: 'm1l', takes: 0, net: 1 },
  { text: 'm1r', takes: 0, net: 1 }, { text: 'kfb', takes: 1, net: 1 }, { text: 'k2tog', takes: 2, net: -1 },
  { text: 'ssk', takes: 2, net: -1 }, { text: 'cdd', takes: 3, net: -2 }, { text: 'sssk', takes: 3, net: -2 },
  { text: '(k1, p1) 2 times', takes: 4, net: 0 }, { text: 'cable 2 over 2 left', takes: 4, net: 0 },
];

/** A random valid round over `n` stitches: operations that fit, then "k to end". */
const roundOver = (n: number) =>
  fc.array(fc.nat({ max: moves.length - 1 }), { maxLength: 12 }).map((picks) => {
    let left = n, net = 0;
    const ops: string[] = [];
    for (const p of picks) {
      const m = moves[p];
      if (m.takes > left || n + net + m.net < 1) continue;
      ops.push(m.text); left -= m.takes; net += m.net;
    }
    ops.push('k to end');
    return { text: ops.join(', '), after: n + net };
  });

describe('conservation in valid rounds', () => {
  it('every round works exactly the stitches on the needle and ends with the predicted count', () => {
    const patterns = fc.integer({ min: 8, max: 60 }).chain((castOn) =>
      fc.integer({ min: 1, max: 6 }).chain((count) => {
        let arb = fc.constant({ lines: [] as string[], expected: [] as number[], n: castOn });
        for (let i = 1; i <= count; i++) {
          arb = arb.chain((acc) => roundOver(acc.n).map((r) => ({ lines: [...acc.lines, `round ${i}: ${r.text}`], expected: [...acc.expected, r.after], n: r.after })));
        }
        return arb.map((acc) => ({ castOn, ...acc }));
      }),
    );
    fc.assert(
      fc.property(patterns, (p) => {
        const r = compile(`yarn A "Harbour" #1d3557\ncast on ${p.castOn}\n${p.lines.join('\n')}`);
        expect(r.diagnostics).toEqual([]);
        const recs = r.sizes[0].stitches.rounds;
        let onNeedle = p.castOn;
        recs.forEach((rec, i) => {
          expect(rec.start).toBe(onNeedle);
          expect(rec.worked).toBe(rec.start);
          expect(rec.front + rec.backing).toBe(rec.count);
          expect(rec.front).toBe(p.expected[i]);
          onNeedle = rec.count;
        });
      }),
      { numRuns: 200 },
    );
  });

  it('with ladder columns, worked + ladder stitches = on the needle, and backing stitches come and go', () => {
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 8 }), fc.integer({ min: 4, max: 12 }), (every, reps) => {
        const width = every * reps;
        const src = `gauge 28 sts and 32 rounds per 10 cm\nyarn A "Harbour" #1d3557\nyarn B "Foam" #cfe8e0\ncast on ${width}\nladder B every ${every} from round 2 to 5\nrounds 1-6: k to end`;
        const r = compile(src);
        expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
        const recs = r.sizes[0].stitches.rounds;
        const columns = reps; // first after ceil(every/2), then every `every`, never after the last stitch
        expect(recs.map((x) => x.backing)).toEqual([0, columns, columns, columns, 0, 0]);
        for (const rec of recs) {
          expect(rec.front).toBe(width);
          const managedIn = rec.start - rec.worked;
          expect(managedIn).toBe(rec.number >= 3 && rec.number <= 5 ? columns : 0);
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('structured random patterns (segments, ladders, charts, flat work)', () => {
  const frag = ['round 1:', 'round 2 at back:', 'rounds 2-5 at palm:', 'rows 1-4:', 'rounds 3-9 every 2nd:', 'round 4 at start:', 'k to end', 'p to end',
    'k 3', 'k2tog', 'ssk', 'yo', 'mark back', 'mark palm', 'unmark back', 'rm palm', 'pm x', 'sm', 'raise B', 'carry', 'close', 'close ssk', 'catch B',
    '(k1, p1) to end', '(k 2, raise B) 3 times', '(k 2, carry) to marker', 'k to marker', 'k to last 2', 'chart c', 'chart c once', 'chart c row 2',
    'cable 1 over 2 left', 'bo 3', 'co 2', 'in B', ',', ',', ',', 'ladder B every 3 from round 2 to 6', 'ladder B columns 2, 5 from round 1 to 4 at back',
    'work flat', 'sizes S M', 'cast on 12/14', 'k 2/3', '\n'];
  const head = 'gauge 28 sts and 32 rounds per 10 cm\nyarn A "a" #112233\nyarn B "b" #ddeeff\nchart c:\n key "." A\n key "x" B\n key "/" A k2tog\n key "o" yo\n |x./o|\n |.xx.|\ncast on 12\n';

  it('never throw, and when they compile without errors every round conserves stitches (ladder stitches worked automatically)', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...frag), { maxLength: 60 }), (parts) => {
        const r = compile(head + parts.join(' '));
        if (!r.ok) return;
        for (const s of r.sizes) {
          const st = s.stitches;
          let prevOff = 0, prevLen = s.castOn;
          for (const rec of st.rounds) {
            let managed = 0;
            for (let i = prevOff; i < prevOff + prevLen; i++) if (st.store.flags[i] & FLAG.MANAGED) managed++;
            expect(rec.start).toBe(prevLen);
            expect(rec.worked + managed).toBe(rec.start);
            expect(rec.front + rec.backing).toBe(rec.count);
            prevOff = rec.offset; prevLen = rec.count;
          }
        }
      }),
      { numRuns: 500 },
    );
  });
});
