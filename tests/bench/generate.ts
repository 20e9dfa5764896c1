/**
 * Generated benchmark patterns: one size, stranded rounds from a two-colour
 * chart, ladder-back columns, and shaping (20 stitches increased and, ten
 * rounds later, decreased again), about `stitches` stitches worked in all.
 * The source stays of realistic length: ranges and "every Nth" lines, not one
 * line per round.
 */

/** Width and rounds for about `stitches` stitches: a square-ish piece, width a multiple of 20. */
export function shape(stitches: number): { width: number; rounds: number } {
  const width = Math.max(40, Math.round(Math.sqrt(stitches) / 20) * 20);
  return { width, rounds: Math.max(20, Math.round(stitches / width)) };
}

/** The source of a generated pattern of about `stitches` stitches. */
export function benchSource(stitches: number): string {
  const { width, rounds } = shape(stitches);
  const lines = [
    '# Generated benchmark pattern',
    'title "Bench swatch"',
    'designer "Loopwright bench"',
    'gauge 28 sts and 32 rounds per 10 cm',
    'yarn A "Harbour" #1d3557',
    'yarn B "Sea Foam" #cfe8e0',
    'work in the round',
    `cast on ${width} in A`,
    'chart motif:',
    '  key "." A',
    '  key "x" B',
    '  |..x....x....x....x..|',
    '  |.xxx..xxx..xxx..xxx.|',
    '  |xx.xxxx.xxxx.xxxx.xx|',
    '  |.xxx..xxx..xxx..xxx.|',
    '  |..x....x....x....x..|',
    '  |....x....x....x....x|',
    '  |...xxx..xxx..xxx..xx|',
    '  |..xx.xxxx.xxxx.xxxx.|',
    '  |...xxx..xxx..xxx..xx|',
    '  |....x....x....x....x|',
    `rounds 1-${rounds}: chart motif`,
    `rounds 6-${rounds} every 20th: (k 2, m1l in B) 20 times, (k 3 in A, k 1 in B) to end`,
    `rounds 16-${rounds} every 20th: (k 1, k2tog) 20 times, k to end in A`,
  ];
  // Ladder-back bands in the plain stretches between shaping rounds.
  for (let first = 8; first + 6 <= rounds; first += 20) lines.push(`ladder B every 6 from round ${first} to ${first + 6}`);
  return lines.join('\n') + '\n';
}
