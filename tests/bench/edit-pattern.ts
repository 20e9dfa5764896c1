/**
 * The pattern of the edit benchmark: a realistic 300-round piece in three
 * sizes, worked in the round with two segments at the same time (a charted
 * back with ladder-back columns behind the chart, a plain front with
 * shaping written round by round, as designers write it), comments and
 * round notes. Plus the one-round edits the benchmark makes to it.
 */

/** Rounds in the edit benchmark's pattern. */
export const EDIT_ROUNDS = 300;

/** The source of the edit benchmark's pattern (compiles with no errors). */
export function editPatternSource(): string {
  const lines = [
    '# Edit benchmark: a long mitt-like tube in three sizes',
    'title "Bench Sleeve"',
    'designer "Loopwright bench"',
    'sizes S M L',
    'gauge 28 sts and 32 rounds per 10 cm',
    'yarn A "Harbour" #1d3557',
    'yarn B "Sea Foam" #cfe8e0',
    'work in the round',
    '',
    'cast on 80/88/96 in A',
    '',
    'rounds 1-10: (k2, p2) to end note "rib"',
    'round 11: mark back, k 40/44/48, mark front, k to end',
    '',
    'chart wave:',
    '  key "." A',
    '  key "x" B',
    '  |..x.....x...|',
    '  |.x.x...x.x..|',
    '  |x...x.x...x.|',
    '  |.....x.....x|',
    '  |x...x.x...x.|',
    '  |.x.x...x.x..|',
    '',
  ];
  // The back: the chart in blocks of 24 rounds, each block with its own ladder.
  let first = 12;
  for (; first + 23 <= EDIT_ROUNDS - 10; first += 24) {
    const last = first + 23;
    lines.push(`# back, block from round ${first}`);
    lines.push(`ladder B every 6 from round ${first} to ${last} at back close ssk`);
    lines.push(`rounds ${first}-${last - 1} at back: k 2/4/6, (chart wave once) 3 times, k to end`);
    lines.push(`round ${last} at back: k 2/4/6, (k1 in A, k1 in B) 18 times, k to end in A note "close the columns"`);
  }
  lines.push(`rounds ${first}-${EDIT_ROUNDS - 10} at back in A: (k 2, catch B) to end`);
  // The front: one line per round, with a decrease and an increase every 8 rounds.
  for (let r = 12; r <= EDIT_ROUNDS - 10; r++) {
    if (r % 8 === 4) lines.push(`round ${r} at front in A: k 1, k2tog, (k 2, catch B) to last 3, ssk, k 1 note "decrease"`);
    else if (r % 8 === 0) lines.push(`round ${r} at front in A: k 1, m1l, (k 2, catch B) to last 1, m1r, k 1`);
    else lines.push(`round ${r} at front in A: (k 2, catch B) to end`);
  }
  lines.push(`rounds ${EDIT_ROUNDS - 9}-${EDIT_ROUNDS - 1}: (k2, p2) to end in A`);
  lines.push(`round ${EDIT_ROUNDS}: bo 80/88/96 in A`);
  return lines.join('\n') + '\n';
}

/** The kinds of one-round edit the benchmark makes. */
export type EditKind = 'instructions' | 'note' | 'comment';

/**
 * `source` with one round edited near the middle: `instructions` changes the
 * stitches of a front round ((k 2, catch B) to end -> purls in it; one variant the same length, one longer);
 * `note` adds a note to it; `comment` changes a comment's words in place.
 * `variant` (0 or 1) alternates between two edits so repeated runs differ
 * from the previous source each time.
 */
export function editOneRound(source: string, kind: EditKind, variant: number): string {
  const round = 150;
  const line = `round ${round} at front in A: (k 2, catch B) to end`;
  if (!source.includes(line)) throw new Error(`edit benchmark: no line "${line}"`);
  if (kind === 'instructions') return source.replace(line, variant % 2 ? `round ${round} at front in A: (p 2, catch B) to end` : `round ${round} at front in A: (k 1, p 1, catch B) to end`);
  if (kind === 'note') return source.replace(line, `${line} note "${variant % 2 ? 'try it on' : 'check length'}"`);
  return source.replace('# back, block from round 132', variant % 2 ? '# BACK, block from round 132' : '# Back: block from round 132');
}
