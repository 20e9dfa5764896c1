/**
 * Regression: a stitch with a huge count on a short needle must finish with a
 * count diagnostic instead of working the stitch billions of times (found by
 * `npm run fuzz`). No timing assertion: a hang would trip Vitest's timeout.
 */
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';

const header = 'yarn A "Deep Harbour" #1d3557\ncast on 10\n';

describe('huge counts on a short needle', () => {
  it('bo 4294967297 on 10 stitches reports LW301 with both numbers', () => {
    const result = compile(`${header}round 1: bo 4294967297\n`);
    const lw301 = result.diagnostics.filter((d) => d.code === 'LW301');
    expect(lw301).toHaveLength(1);
    expect(lw301[0].message).toContain('4294967297');
    expect(lw301[0].message).toContain('10 are on the needle');
    expect(result.ok).toBe(false);
  });

  it('k2tog 99999999 stops at the 2,000,000-stitch bound (LW901)', () => {
    const result = compile(`${header}round 1: k2tog 99999999\n`);
    expect(result.diagnostics.map((d) => d.code)).toContain('LW901');
  });

  it('k 999999 after a bind-off of the whole needle counts what it could not work', () => {
    const result = compile(`${header}round 1: bo 10, k 999999\n`);
    const lw301 = result.diagnostics.find((d) => d.code === 'LW301');
    expect(lw301?.message).toContain('1000009');
  });
});

// A repeat whose passes take and give nothing once the needle is used up is
// counted at once (shared/check/ops.ts skipIdlePasses); the result must be the
// one working every pass gives (found by `npm run fuzz`: such repeats spun for
// seconds before LW901).
describe('repeats that run on after the needle is used up', () => {
  const writtenOut = (n: number, body: string) => Array.from({ length: n }, () => body).join(', ');

  it('counts the same as the same passes written out, whatever the number of passes', () => {
    for (const n of [1, 2, 3, 4, 7]) {
      const repeated = compile(`${header}round 1: k 10, (k1, close) ${n} times\n`);
      const spelled = compile(`${header}round 1: k 10, ${writtenOut(n, 'k1, close')}\n`);
      // The same problems (written out, each close is its own place, so each is reported)...
      expect(new Set(repeated.diagnostics.map((d) => d.code))).toEqual(new Set(spelled.diagnostics.map((d) => d.code)));
      // ...and the same round: stitches on the needle and stitches the operations asked for.
      expect(repeated.sizes[0].rounds).toEqual(spelled.sizes[0].rounds.map((r, i) => ({ ...r, span: repeated.sizes[0].rounds[i].span })));
      expect(repeated.sizes[0].stitches.rounds[0].worked).toBe(spelled.sizes[0].stitches.rounds[0].worked);
    }
  });

  it('a million idle passes ask for 3 stitches each (k1 and close), as a loop would', () => {
    const result = compile(`${header}round 1: k 10, (k1, close) 1000000 times\n`);
    expect(result.sizes[0].stitches.rounds[0].worked).toBe(10 + 3 * 1_000_000);
    expect(result.diagnostics.map((d) => d.code)).toEqual(['LW405']);
  });

  it('past 2,000,000 idle passes the size stops with LW901, as before', () => {
    const result = compile(`${header}round 1: k 10, (k1, close) 9007199254740993 times\n`);
    const lw901 = result.diagnostics.find((d) => d.code === 'LW901');
    expect(lw901?.message).toContain('2,000,000 repeat passes that work no stitch');
  });
});

describe('a cable wider than the needle', () => {
  it('cable 1000000 over 1 on 10 stitches says how many it needs and how many were left (LW303)', () => {
    const result = compile(`${header}round 1: cable 1000000 over 1 right\n`);
    const lw303 = result.diagnostics.find((d) => d.code === 'LW303');
    expect(lw303?.message).toContain('1000001');
    expect(result.sizes[0].rounds[0].front).toBe(10);
  });
});

// A round number far ahead leaves a gap of rounds with no instructions
// (LW209); each gap round is the needle carried on unchanged, so it shares
// the stitches of the round before it (found by `npm run fuzz`: a gap of
// 90,000 rounds took 0.15 s when each record was copied by object spread).
describe('a gap of tens of thousands of rounds', () => {
  it('reports the gap once (LW209, rounds 2 to 39999) and keeps one record per round, sharing the stitches', () => {
    const result = compile(`${header}round 1: k to end\nround 40000: k to end\n`);
    const codes = result.diagnostics.map((d) => d.code);
    const gaps = result.diagnostics.filter((d) => d.code === 'LW209');
    expect(gaps).toHaveLength(1);
    expect(gaps[0].message).toBe('rounds 2 to 39999 have no instructions');
    expect(codes).not.toContain('LW902');
    const { rounds, store } = result.sizes[0].stitches;
    expect(rounds).toHaveLength(40000);
    expect(rounds.map((r) => r.number).slice(0, 3)).toEqual([1, 2, 3]);
    expect(rounds[39999].number).toBe(40000);
    // Round 2 carries the stitches over (as unworked), round 3 settles; every later gap round
    // stands for the same 10 stitches without storing them again.
    expect(rounds.slice(2, -1).every((r) => r.offset === rounds[2].offset && r.count === 10)).toBe(true);
    expect(store.length).toBeLessThan(100);
  });
});

// The stitch and idle-pass bounds leave the operations of one pass free: a
// repeat of hundreds of operations that together make one stitch a pass ran
// for minutes below the stitch bound (found by `npm run fuzz`). Operations
// carried out are bounded too (LIMITS.operations) and counted in the model.
describe('operations carried out', () => {
  const markPairs = Array.from({ length: 200 }, () => 'mark x, unmark x').join(', ');

  it('a repeat of 400 operations and a yo stops at 5,000,000 operations (LW901), well before the stitch bound', () => {
    const result = compile(`${header}round 1: (${markPairs}, yo) 99999999 times\n`);
    const lw901 = result.diagnostics.find((d) => d.code === 'LW901');
    expect(lw901?.message).toContain('more than 5,000,000 operations would be carried out');
    // 401 operations a pass: about 12,469 passes (one yo each) fit in the bound.
    expect(result.sizes[0].stitches.operations).toBeLessThanOrEqual(5_000_001);
    expect(result.sizes[0].stitches.store.length).toBeLessThan(10 + 12_500);
  });

  it('counts each operation once per pass: 20 flat rows of (k1, p1) to end on 50,000 stitches carry out 1,000,020', () => {
    // Per row: the group itself, then 25,000 passes of k1 and p1 (flat rows turn, so no row is taken over from another).
    const result = compile(`yarn A "Deep Harbour" #1d3557\nwork flat\ncast on 50000\nrows 1-20: (k1, p1) to end\n`);
    expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(result.sizes[0].stitches.operations).toBe(20 * (1 + 2 * 25_000));
  });

  it('a round repeated on an unchanged needle is not worked again, so its operations count once', () => {
    const result = compile(`${header}rounds 1-20: (k1, p1) to end\n`);
    expect(result.sizes[0].stitches.operations).toBe(1 + 2 * 5);
  });
});

describe('a cast-on past the stitch bound', () => {
  it('stops each size at the cast-on (LW901) with nothing worked (found by `npm run fuzz`: room for 2,000,000 stitches was made first)', () => {
    const result = compile('sizes S M L XL\nyarn A "Deep Harbour" #1d3557\ncast on 4294967297\nrounds 1-11: p to end\n');
    const lw901 = result.diagnostics.filter((d) => d.code === 'LW901');
    expect(lw901.map((d) => d.size)).toEqual(['S', 'M', 'L', 'XL']);
    expect(result.sizes.map((s) => s.stitches.store.length)).toEqual([0, 0, 0, 0]);
  });
});
