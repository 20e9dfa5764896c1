/**
 * A grammar-aware fast-check arbitrary for Loopwright sources, built from
 * grammar/reference.md: header lines (title, designer, sizes, gauge, yarns,
 * construction, float limit), graded numbers, cast-on, round/row lines with
 * ranges, `every Nth`, `in`, `at`, notes, operations with counts and
 * "to end / to last N / to marker", nested repeats, charts with keys and
 * grids, markers and segments, backing stitches (raise, carry, close,
 * catch) and ladder lines, plus comments.
 *
 * Most output is well formed so the checker (not just the parser) is
 * exercised; a small share of pieces is deliberately off (wrong number of
 * graded values, unknown names, stray words) so error paths run too.
 * Counts stay small (cast-on up to 120, rounds up to 40) so one case is
 * cheap; an occasional huge count checks the compiler's limits.
 */
import fc from 'fast-check';

/** Names the generator uses for yarns, segments/markers and charts. */
const YARNS = ['A', 'B', 'C', 'MC', 'cc2'] as const;
const MARKERS = ['back', 'palm', 'gusset', 'hand', 'side', 'm1x'] as const;
const CHARTS = ['wave', 'lantern', 'dots'] as const;

/** Stitch words from the operations table of the reference (takes/puts are the checker's job). */
const PLAIN_STITCHES = [
  'k', 'p', 'k tbl', 'p tbl', 'ktbl', 'sl', 'sl wyib', 'sl wyif', 'yo', 'm1', 'm1l', 'm1r', 'lli', 'rli', 'kfb', 'pfb',
  'k2tog', 'ssk', 'p2tog', 'ssp', 'skpo', 'k3tog', 'sssk', 'cdd', 'sk2p',
] as const;

/** `arb` once in `1 + absentWeight` cases, else `absent`. */
function sometimes<T, N>(arb: fc.Arbitrary<T>, absent: N, absentWeight: number): fc.Arbitrary<T | N> {
  return fc.oneof({ weight: 1, arbitrary: arb }, { weight: absentWeight, arbitrary: fc.constant(absent) });
}

/** `arb` in `presentWeight` cases out of `presentWeight + 1`, else `absent`. */
function mostly<T, N>(arb: fc.Arbitrary<T>, absent: N, presentWeight: number): fc.Arbitrary<T | N> {
  return fc.oneof({ weight: presentWeight, arbitrary: arb }, { weight: 1, arbitrary: fc.constant(absent) });
}

/** A small count, sometimes written glued to the stitch (`k2`) by the caller. */
const smallCount = fc.integer({ min: 1, max: 12 });
/** Mostly small, occasionally huge (the compiler must refuse it with a diagnostic, not run away). */
const count = fc.oneof({ weight: 60, arbitrary: fc.integer({ min: 1, max: 40 }) }, { weight: 1, arbitrary: fc.constantFrom(0, 999_999, 99_999_999, 2_000_000_000) });

/** Shared context: how many sizes the header declares (graded numbers follow it). */
interface Ctx { sizes: number; yarns: readonly string[]; flat: boolean }

/** A graded number: one value, or one per size (sometimes the wrong number of values: LW201). */
function graded(ctx: Ctx, base: fc.Arbitrary<number>): fc.Arbitrary<string> {
  const perSize = fc.array(base, { minLength: ctx.sizes, maxLength: ctx.sizes }).map((v) => v.join('/'));
  const wrong = fc.array(base, { minLength: 2, maxLength: 4 }).map((v) => v.join('/'));
  return fc.oneof({ weight: 6, arbitrary: base.map(String) }, { weight: ctx.sizes > 1 ? 4 : 0, arbitrary: perSize }, { weight: 1, arbitrary: wrong });
}

const quoted = fc.oneof(
  fc.constantFrom('Harbour', 'Sea Foam', 'Lamp Black', 'Chalk', 'Slate', 'Tidepool Cowl', 'cuff rib', 'change needle'),
  fc.string({ maxLength: 20 }).map((s) => s.replace(/["\n\r]/g, '')),
).map((s) => `"${s}"`);
const colour = fc.integer({ min: 0, max: 0xffffff }).map((n) => `#${n.toString(16).padStart(6, '0')}`);

function yarnRef(ctx: Ctx): fc.Arbitrary<string> {
  return fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...ctx.yarns) }, { weight: 1, arbitrary: fc.constantFrom('Z', 'nope') });
}

/** Where a running stitch or repeat stops. */
function place(): fc.Arbitrary<string> {
  return fc.oneof(
    fc.constant('to end'),
    smallCount.map((n) => `to last ${n}`),
    fc.constant('to marker'),
    fc.constantFrom(...MARKERS).map((m) => `to marker ${m}`),
  );
}

/** One operation (not a repeat). */
function simpleOp(ctx: Ctx): fc.Arbitrary<string> {
  const inYarn = sometimes(yarnRef(ctx).map((y) => ` in ${y}`), '', 3);
  const stitch = fc.tuple(fc.constantFrom(...PLAIN_STITCHES), fc.oneof(fc.constant(''), count.map((n) => ` ${n}`), place().map((p) => ` ${p}`)), inYarn)
    .map(([s, c, y]) => `${s}${c}${y}`);
  const glued = fc.tuple(fc.constantFrom('k', 'p', 'sl'), smallCount, inYarn).map(([s, n, y]) => `${s}${n}${y}`);
  return fc.oneof(
    { weight: 12, arbitrary: stitch },
    { weight: 4, arbitrary: glued },
    { weight: 1, arbitrary: smallCount.map((n) => `co ${n}`) },
    { weight: 1, arbitrary: smallCount.map((n) => `bo ${n}`) },
    { weight: 1, arbitrary: fc.tuple(fc.integer({ min: 1, max: 3 }), fc.integer({ min: 1, max: 3 }), fc.constantFrom('left', 'right')).map(([a, b, d]) => `cable ${a} over ${b} ${d}`) },
    { weight: 2, arbitrary: yarnRef(ctx).map((y) => `raise ${y}`) },
    { weight: 2, arbitrary: sometimes(smallCount, undefined, 1).map((n) => (n === undefined ? 'carry' : `carry ${n}`)) },
    { weight: 2, arbitrary: fc.constantFrom('close', 'close ssk') },
    { weight: 1, arbitrary: yarnRef(ctx).map((y) => `catch ${y}`) },
    { weight: 2, arbitrary: fc.constantFrom(...MARKERS).map((m) => `mark ${m}`) },
    { weight: 1, arbitrary: fc.constantFrom(...MARKERS).map((m) => `unmark ${m}`) },
    { weight: 2, arbitrary: fc.tuple(fc.constantFrom(...CHARTS), fc.constantFrom('', ' once', ' row 2', ' row 1')).map(([c, w]) => `chart ${c}${w}`) },
  );
}

/** A list of operations with nested repeats, depth-bounded. */
function ops(ctx: Ctx, depth: number): fc.Arbitrary<string> {
  const item: fc.Arbitrary<string> = depth <= 0
    ? simpleOp(ctx)
    : fc.oneof(
        { weight: 5, arbitrary: simpleOp(ctx) },
        {
          weight: 1,
          arbitrary: fc.tuple(ops(ctx, depth - 1), fc.oneof(smallCount.map((n) => ` ${n} times`), place().map((p) => ` ${p}`), fc.constant(' once'), fc.constant('')))
            .map(([inner, how]) => `(${inner})${how}`),
        },
      );
  return fc.array(item, { minLength: 1, maxLength: 6 }).map((a) => a.join(', '));
}

/** A round/row line: `rounds 3-9 every 2nd in B at back: ops note "..."`. */
function roundLine(ctx: Ctx, maxRound: number): fc.Arbitrary<string> {
  const word = ctx.flat
    ? fc.constantFrom('row', 'rows', 'row', 'rows', 'round')
    : fc.constantFrom('round', 'rounds', 'round', 'rounds', 'row');
  const num = fc.integer({ min: 1, max: maxRound });
  const range = fc.oneof(
    graded(ctx, num),
    fc.tuple(num, num).map(([a, b]) => `${Math.min(a, b)}-${Math.max(a, b)}`),
    fc.tuple(graded(ctx, num), graded(ctx, num)).map(([a, b]) => `${a}-${b}`),
  );
  const every = fc.oneof({ weight: 4, arbitrary: fc.constant('') }, { weight: 1, arbitrary: fc.constantFrom(' every other', ' every 2nd', ' every 3rd', ' every 4th', ' every 6th', ' every 1st') });
  const inYarn = sometimes(yarnRef(ctx).map((y) => ` in ${y}`), '', 4);
  const at = sometimes(fc.constantFrom(...MARKERS, 'start').map((m) => ` at ${m}`), '', 4);
  const note = sometimes(quoted.map((q) => ` note ${q}`), '', 5);
  const trailingOpsYarn = sometimes(yarnRef(ctx).map((y) => ` in ${y}`), '', 8);
  return fc.tuple(word, range, every, inYarn, at, ops(ctx, 2), trailingOpsYarn, note)
    .map(([w, r, e, y, a, o, t, n]) => `${w} ${r}${e}${y}${a}: ${o}${t}${n}`);
}

/** A chart block with a key and a grid of equal-width rows (sometimes ragged or with an unknown cell). */
function chartBlock(ctx: Ctx): fc.Arbitrary<string> {
  const cells = ['.', 'x', '/', 'o', '-'];
  const keyLines = fc.tuple(fc.constantFrom(...ctx.yarns), fc.constantFrom(...ctx.yarns)).map(([a, b]) => [
    `  key "." ${a}`, `  key "x" ${b}`, `  key "/" ${a} k2tog`, '  key "o" yo', '  key "-" none',
  ]);
  const width = fc.integer({ min: 1, max: 14 });
  const grid = width.chain((w) =>
    fc.array(fc.oneof({ weight: 10, arbitrary: fc.array(fc.constantFrom(...cells), { minLength: w, maxLength: w }) }, { weight: 1, arbitrary: fc.array(fc.constantFrom(...cells, '?'), { maxLength: w + 2 }) }), { minLength: 1, maxLength: 12 }),
  ).map((rows) => rows.map((r) => `  |${r.join('')}|`));
  return fc.tuple(fc.constantFrom(...CHARTS), keyLines, fc.subarray([0, 1, 2, 3, 4]), grid)
    .map(([name, keys, drop, rows]) => [`chart ${name}:`, ...keys.filter((_, i) => !drop.includes(i) || i < 2), ...rows].join('\n'));
}

/** A ladder line (automatic backing columns). */
function ladderLine(ctx: Ctx, maxRound: number): fc.Arbitrary<string> {
  const word = ctx.flat ? 'row' : 'round';
  const cols = fc.oneof(
    fc.integer({ min: 1, max: 12 }).map((n) => `every ${n}`),
    fc.array(fc.integer({ min: 1, max: 60 }), { minLength: 1, maxLength: 5 }).map((a) => `columns ${a.join(', ')}`),
  );
  return fc.tuple(yarnRef(ctx), cols, fc.integer({ min: 1, max: maxRound }), fc.integer({ min: 1, max: maxRound }),
    sometimes(fc.constantFrom(...MARKERS).map((m) => ` at ${m}`), '', 3), fc.constantFrom('', '', ' close ssk'))
    .map(([y, c, a, b, at, close]) => `ladder ${y} ${c} from ${word} ${Math.min(a, b)} to ${Math.max(a, b)}${at}${close}`);
}

const comment = fc.constantFrom('# a comment', '# Size S is the sample size.', '#', '# k to end');

/** Header lines in a plausible order (any of them may be missing). */
function headerLines(ctx: Ctx, sizeNames: string[]): fc.Arbitrary<string[]> {
  const gauge = fc.tuple(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 50 }), fc.constantFrom('rounds', 'rows'), fc.constantFrom('per', 'over'), fc.constantFrom('10 cm', '4 in', '2.5 cm', '0 cm'), fc.boolean())
    .map(([s, r, w, p, len, and]) => `gauge ${s} sts${and ? ' and' : ''} ${r} ${w} ${p} ${len}`);
  const yarnDecls = ctx.yarns.map((y) => fc.tuple(quoted, colour).map(([l, c]) => `yarn ${y} ${l} ${c}`));
  const optional = (a: fc.Arbitrary<string>, absentWeight = 2) => sometimes(a, null, absentWeight);
  return fc.tuple(
    optional(quoted.map((q) => `title ${q}`)),
    optional(quoted.map((q) => `designer ${q}`)),
    fc.constant(sizeNames.length > 0 ? `sizes ${sizeNames.join(' ')}` : null),
    optional(gauge, 1),
    fc.tuple(...yarnDecls),
    fc.constant(ctx.flat ? 'work flat' : 'work in the round'),
    optional(fc.tuple(fc.constantFrom('1', '2', '0.5', '2.5', '0'), fc.constantFrom('in', 'cm')).map(([v, u]) => `float limit ${v} ${u}`), 5),
  ).map(([t, d, s, g, ys, w, f]) => [t, d, s, g, ...ys, w, f].filter((x): x is string => x !== null));
}

/**
 * A whole source: header, cast-on, then a mix of round lines, charts,
 * ladders and comments. `maxLines` bounds the body.
 */
export function loopSource(maxLines = 14): fc.Arbitrary<string> {
  const sizeSets = fc.constantFrom<string[]>([], ['S', 'M', 'L'], ['1', '2', '3', '4'], ['"2XL"', 'XS'], ['S']);
  const setup = fc.tuple(sizeSets, fc.integer({ min: 1, max: 3 }), fc.boolean(), fc.integer({ min: 1, max: 40 }));
  return setup.chain(([sizeNames, yarnCount, flat, maxRound]) => {
    const ctx: Ctx = { sizes: Math.max(1, sizeNames.length), yarns: YARNS.slice(0, yarnCount), flat };
    const castOn = fc.tuple(graded(ctx, fc.oneof({ weight: 40, arbitrary: fc.integer({ min: 1, max: 120 }) }, { weight: 1, arbitrary: count })), sometimes(yarnRef(ctx), undefined, 2))
      .map(([n, y]) => `cast on ${n}${y ? ` in ${y}` : ''}`);
    const bodyLine = fc.oneof(
      { weight: 10, arbitrary: roundLine(ctx, maxRound) },
      { weight: 2, arbitrary: chartBlock(ctx) },
      { weight: 2, arbitrary: ladderLine(ctx, maxRound) },
      { weight: 1, arbitrary: comment },
      { weight: 1, arbitrary: fc.constant('') },
    );
    // A full cover of the rounds first, so most sources reach the checker without LW209.
    const cover = fc.constantFrom('k to end', '(k2, p2) to end', '(k1, p1) to end', 'p to end').map((o) => `${flat ? 'rows' : 'rounds'} 1-${maxRound}: ${o}`);
    return fc.tuple(headerLines(ctx, sizeNames), mostly(castOn, null, 12), mostly(cover, null, 2), fc.array(bodyLine, { maxLength: maxLines }))
      .map(([header, cast, cov, body]) => [...header, ...(cast ? [cast] : []), ...(cov ? [cov] : []), ...body].join('\n') + '\n');
  });
}
