// Benchmark of the semantic diff (not a test: speed is measured, never asserted).
//   npx tsx tests/shared/diff/bench-diff.ts
// A 300-round, three-size source (Tidepool Cowl, invented) against an edited
// copy: the diff's cost as a multiple of compiling both revisions.
import { compile } from '../../../shared/index.ts';
import { diffRevisions } from '../../../shared/diff/index.ts';

function cowl(extraRound: boolean, recolour: boolean, castOn = '224/252/280'): string {
  const lines = [
    'title "Tidepool Cowl"', 'designer "Maren Tolley"', 'sizes S M L', 'gauge 28 sts and 32 rounds per 10 cm',
    'yarn A "Harbour" #1d3557', 'yarn B "Sea Foam" #e6f2ee', 'work in the round', `cast on ${castOn} in A`,
    'chart wave:', '  key "." A', '  key "x" B', '  |..xx..xx|', recolour ? '  |.xx..x..|' : '  |.xx..xx.|', '  |xx..xx..|',
  ];
  const shift = extraRound ? 1 : 0;
  lines.push('rounds 1-10: (k2, p2) to end');
  if (extraRound) lines.push('round 11: k to end');
  lines.push(`rounds ${11 + shift}-${150 + shift}: chart wave`);
  lines.push(`rounds ${151 + shift}-${290 + shift}: k to end`);
  lines.push(`ladder B every 7 from round ${160 + shift} to ${280 + shift}`);
  lines.push(`rounds ${291 + shift}-${300 + shift}: (k2, p2) to end`);
  return `${lines.join('\n')}\n`;
}

/** Best of `reps` runs after a warm-up (the machine is shared; the minimum is the least noisy). */
function time(label: string, f: () => unknown, reps = 9): number {
  f();
  let ms = Infinity;
  for (let i = 0; i < reps; i++) {
    const t0 = performance.now();
    f();
    ms = Math.min(ms, performance.now() - t0);
  }
  process.stdout.write(`${label.padEnd(44)} ${ms.toFixed(1).padStart(8)} ms\n`);
  return ms;
}

const base = cowl(false, false);
const pairs: [string, string][] = [
  ['one chart cell recoloured', cowl(false, true)],
  ['a round inserted after round 10', cowl(true, false)],
  ['cast on changed (every round differs)', cowl(false, false, '232/260/288')],
];
const stitches = compile(base).sizes.reduce((t, s) => t + s.stitches.store.length, 0);
process.stdout.write(`source: ${compile(base).sizes[0].rounds.length} rounds x 3 sizes, ${stitches} stitches stored\n`);
for (const [label, other] of pairs) {
  const compiles = time(`${label}: compile both`, () => { compile(base); compile(other); });
  const diff = time(`${label}: diffRevisions`, () => diffRevisions(base, other));
  process.stdout.write(`${''.padEnd(44)} ratio ${(diff / compiles).toFixed(2)}\n`);
}
