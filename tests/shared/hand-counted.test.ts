/**
 * A pattern counted by hand: backing stitches set up, worked and closed,
 * stranded rounds, and a gusset in its own segment at the same time. The
 * expected counts and floats were worked out on paper (comments below); the
 * compiler must agree round by round.
 *
 * Gauge 28 sts per 10 cm = 7.11 sts/in, so the 1 in float limit is 7 stitches.
 */
import { describe, expect, it } from 'vitest';
import { compile, toCheckJson } from '../../shared/index.ts';

const source = `gauge 28 sts and 32 rounds per 10 cm
yarn A "Harbour" #1d3557
yarn B "Sea Foam" #cfe8e0
cast on 24 in A
round 1: mark back, k 12, mark palm, k to end
round 2 at back: (k 3 in A, raise B) 3 times, k 3 in A
round 2 at palm: (k1 in A, k1 in B) to end
rounds 3-4 at back: (k 3 in A, carry) 3 times, k 3 in A
round 3 at palm: mark gusset, m1l in A, m1r in A, mark hand, (k1 in A, k1 in B) to end
round 4 at gusset: m1l in B, k to end in B, m1r in B
rounds 4-5 at hand: (k1 in A, k1 in B) to end
round 5 at back in A: k 3, (close, k 2) 3 times, k to end
round 5 at gusset: k to end in A
round 6: k to end in A
`;

describe('a pattern counted by hand', () => {
  const r = compile(source);
  const rounds = toCheckJson(r).sizes[0].rounds;

  it('has the hand-counted front, backing and total per round', () => {
    expect(rounds.map((x) => [x.number, x.front, x.backing, x.total])).toEqual([
      [1, 24, 0, 24], // markers only
      [2, 24, 3, 27], // 3 backing stitches raised in B on the back
      [3, 26, 3, 29], // gusset: m1l, m1r (+2 front); backing carried
      [4, 28, 3, 31], // gusset +2 in B stripes
      [5, 28, 0, 28], // each backing stitch closed with the front stitch after it (k2tog): -3 total, front unchanged
      [6, 28, 0, 28],
    ]);
  });

  it('has the hand-measured longest float per round', () => {
    expect(rounds.map((x) => x.longestFloat)).toEqual([
      null, // one yarn
      { yarn: 'B', stitches: 4 }, // last backing B after front 9, next B at front 14 (0-based 13): 4 stitches
      { yarn: 'B', stitches: 6 }, // after the backing at 9, B next in the hand at front 16 (0-based 15): 6
      { yarn: 'A', stitches: 4 }, // A passes behind the 4 gusset stitches in B
      { yarn: 'B', stitches: 17 }, // backing closed: B only in the hand, from front 18 round to front 18: 17
      null,
    ]);
  });

  it('warns exactly once, for the 17-stitch float of round 5 (2.39 in / 6.1 cm)', () => {
    // The float ends at the hand's first B stitch: the hand line (line 11).
    expect(r.diagnostics.map((d) => [d.code, d.span.line])).toEqual([['LW501', 11]]);
    expect(r.diagnostics[0].message).toBe('round 5: yarn B floats behind 17 stitches (2.39 in / 6.1 cm), longer than the 1 in limit');
    expect(r.diagnostics[0].hint).toBe('catch B every 7 stitches or fewer, or add a backing column');
  });

  it('keeps the gusset in its own segment while the back works its columns', () => {
    const rec = r.sizes[0].stitches.rounds[3];
    expect(rec.segments.filter((s) => s.to > s.from).map((s) => [s.name, s.to - s.from])).toEqual([['back', 15], ['gusset', 2], ['hand', 12]]);
    expect(rec.markers.map((m) => m.name)).toEqual(['back', 'palm', 'gusset', 'hand']);
  });
});
