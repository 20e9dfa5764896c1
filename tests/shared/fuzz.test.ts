/**
 * Two thousand of the `npm run fuzz` cases (tests/fuzz/): grammar-generated
 * sources and mutated demo patterns, broken fixtures and generated sources.
 * The compiler must never throw, keep every span inside the source with
 * matching line/column, and give the same JSON twice (house-style.md,
 * "Property tests"; contracts.md, `compile`). Speed is the fuzz run's and
 * the bench's business, never a timed test (rules.md).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';
import { applyMutation, type Mutation } from '../fuzz/mutate.ts';
import { assertSource, budgetFor, checkSource, firstDifference, fuzzCase, loadCorpus, spanProblem } from '../fuzz/properties.ts';

const corpus = loadCorpus();

/**
 * A count of 100,000 or more (not part of a #colour). The fuzz run found
 * that such counts cost the compiler time in proportion to the count even
 * on a short round (`bo 4294967297` runs for tens of seconds), so npm test
 * leaves those cases to `npm run fuzz`; the huge-count limits themselves are
 * checked in properties.test.ts.
 */
const HUGE_COUNT = /(?<![#\w])\d{6,}/;

describe('fuzz cases (the arbitrary of npm run fuzz)', () => {
  it('2,000 cases: no throw, spans in bounds, deterministic', () => {
    fc.assert(fc.property(fuzzCase(corpus).filter((c) => !HUGE_COUNT.test(c.source)), (c) => assertSource(c.source)), { numRuns: 2000 });
  }, 600_000);
});

describe('the fuzz harness itself', () => {
  it('reads the demo patterns and the broken fixtures as seeds', () => {
    expect(corpus.demo.map((c) => c.file)).toContain('examples/tidepool-cowl.loop');
    expect(corpus.broken.length).toBeGreaterThanOrEqual(30);
  });

  it('generated sources mostly compile without errors, so the checker is exercised and not only the parser', () => {
    const cases = fc.sample(fuzzCase(corpus).filter((c) => c.kind === 'generated'), { numRuns: 300, seed: 7 });
    const reachedChecker = cases.filter((c) => compile(c.source).sizes.some((s) => s.rounds.length > 0)).length;
    expect(reachedChecker / cases.length).toBeGreaterThan(0.3);
  });

  it('mutations apply as described', () => {
    const s = 'round 1: k to end\nround 2: p to end';
    const cases: [Mutation, string][] = [
      [{ kind: 'insert-token', at: 9, token: 'k2tog' }, 'round 1: k2togk to end\nround 2: p to end'],
      [{ kind: 'delete', at: 0, length: 6 }, '1: k to end\nround 2: p to end'],
      [{ kind: 'swap-lines', a: 0, b: 1 }, 'round 2: p to end\nround 1: k to end'],
      [{ kind: 'truncate', at: 7 }, 'round 1'],
      [{ kind: 'extreme-number', nth: 1, value: '99999999' }, 'round 1: k to end\nround 99999999: p to end'],
      [{ kind: 'duplicate-line', line: 3, times: 1 }, 'round 1: k to end\nround 2: p to end\nround 2: p to end'],
    ];
    for (const [m, expected] of cases) expect(applyMutation(s, m), m.kind).toBe(expected);
    // A swap of two equal words changes nothing; of two different stretches, exchanges them.
    expect(applyMutation(s, { kind: 'swap', a: 0, b: 18, length: 5 })).toBe(s);
    expect(applyMutation('abcXYZdef', { kind: 'swap', a: 0, b: 6, length: 3 })).toBe('defXYZabc');
  });

  it('the span check catches a wrong line, a wrong column and an offset past the end (so a pass means something)', () => {
    const src = 'ab\r\ncd\ref';
    const starts = [0, 4, 7];
    expect(spanProblem(src, starts, { from: 4, to: 6, line: 2, column: 1, endLine: 2, endColumn: 3 })).toBeNull();
    expect(spanProblem(src, starts, { from: 7, to: 9, line: 3, column: 1, endLine: 3, endColumn: 3 })).toBeNull();
    expect(spanProblem(src, starts, { from: 4, to: 6, line: 1, column: 5, endLine: 2, endColumn: 3 })).toMatch(/start/);
    expect(spanProblem(src, starts, { from: 4, to: 6, line: 2, column: 1, endLine: 2, endColumn: 4 })).toMatch(/end/);
    expect(spanProblem(src, starts, { from: 4, to: 99, line: 2, column: 1, endLine: 2, endColumn: 3 })).toMatch(/outside/);
  });

  it('the determinism comparison covers the whole result, the stitch-level model included (so a pass means something)', () => {
    const source = 'yarn A "Harbour" #1d3557\ncast on 10\nrounds 1-3: k to end\n';
    const a = compile(source), b = compile(source);
    expect(firstDifference(a, b)).toBeNull();
    b.sizes[0].stitches.store.op[12] ^= 1; // one stitch of round 1 worked differently: the CLI JSON would not show it
    expect(firstDifference(a, b)).toBe('.sizes[0].stitches.store.op[byte 12]');
    const c = compile(source);
    c.diagnostics.push({ code: 'LW999', severity: 'info', span: c.sizes[0].rounds[0].span, message: 'an extra diagnostic' });
    expect(firstDifference(a, c)).toBe('.diagnostics.length');
    expect(firstDifference({ x: 1, y: undefined }, { x: 1 })).toMatch(/keys/);
    expect(firstDifference([Number.NaN], [Number.NaN])).toBeNull();
  });

  it('checkSource reports the stitches of the model and a timing', () => {
    const r = checkSource('yarn A "Harbour" #1d3557\ncast on 10\nrounds 1-3: k to end\n');
    expect(r.failure).toBeNull();
    // The cast-on's 10 and 3 rounds of 10 (common practice: a plain round works every stitch once).
    expect(r.stitches).toBe(40);
    // Round 1's one operation; rounds 2-3 repeat it on an unchanged needle and are not worked again (reuse.ts).
    expect(r.operations).toBe(1);
    expect(r.cpuMs).toBeGreaterThanOrEqual(0);
  });

  it('counts a cast-on with no rounds as the stitches of the model', () => {
    // Three sizes, each casting on 1000: the model holds 3000 stitches though no round is worked.
    const r = checkSource('sizes S M L\nyarn A "Harbour" #1d3557\ncast on 1000\n');
    expect(r.stitches).toBe(3000);
    expect(r.rounds).toBe(0);
  });

  it('counts the round records of every size, a gap of rounds without stitches too', () => {
    // Rounds 2-499 have no instructions (LW209) and there is nothing on the needle, yet each size keeps 500 records.
    const r = checkSource('sizes S M L\nyarn A "Harbour" #1d3557\ncast on 0\nround 1: k to end\nround 500: k to end\n');
    expect(r.stitches).toBe(0);
    expect(r.rounds).toBe(1500);
  });

  it('gives models past 100,000 stitches and rounds a budget in proportion', () => {
    expect(budgetFor(40)).toBe(100);
    expect(budgetFor(100_000)).toBe(100);
    expect(budgetFor(300_000)).toBe(300);
  });
});
