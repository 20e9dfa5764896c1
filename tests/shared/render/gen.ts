/**
 * Generated patterns for property tests: random rounds of stitches (some in
 * a second yarn, some worked as a bracketed repeat), each completed with
 * "k to end" so that it adds up, and sometimes a ladder line.
 */
import fc from 'fast-check';
import { HEADER } from './helpers.ts';

const stitchOps = [
  { text: 'k', take: 1, put: 1 }, { text: 'p', take: 1, put: 1 }, { text: 'k2tog', take: 2, put: 1 },
  { text: 'ssk', take: 2, put: 1 }, { text: 'yo', take: 0, put: 1 }, { text: 'm1l', take: 0, put: 1 },
  { text: 'kfb', take: 1, put: 2 }, { text: 'k3tog', take: 3, put: 1 }, { text: 'k tbl', take: 1, put: 1 },
] as const;

const roundGen = fc.array(fc.record({ op: fc.constantFrom(...stitchOps), n: fc.integer({ min: 1, max: 3 }), inB: fc.boolean() }), { minLength: 0, maxLength: 5 });
export const patternGen = fc.record({
  castOn: fc.integer({ min: 6, max: 30 }),
  rounds: fc.array(fc.record({ ops: roundGen, repeat: fc.integer({ min: 1, max: 3 }), span: fc.integer({ min: 1, max: 3 }) }), { minLength: 1, maxLength: 8 }),
  ladder: fc.option(fc.record({ every: fc.integer({ min: 3, max: 6 }), from: fc.integer({ min: 1, max: 3 }), span: fc.integer({ min: 1, max: 4 }) }), { nil: null }),
});

/** A generated pattern. */
export type Pattern = typeof patternGen extends fc.Arbitrary<infer T> ? T : never;

/**
 * Builds a source whose every round adds up: the listed stitches (only as
 * far as they fit), repeated as a bracketed group when that fits too, then
 * "k to end". A line whose rounds keep the count may cover a range.
 */
export function buildSource(p: Pattern): string {
  let n = p.castOn;
  let round = 1;
  const lines = [`${HEADER}`, `cast on ${p.castOn} in A`];
  for (const r of p.rounds) {
    const parts: string[] = [];
    let take = 0, put = 0;
    for (const o of r.ops) {
      if (take + o.op.take * o.n > n || n - take + put + o.op.put * o.n > 400) continue;
      parts.push(`${o.op.text} ${o.n}${o.inB ? ' in B' : ''}`);
      take += o.op.take * o.n;
      put += o.op.put * o.n;
    }
    let reps = 1;
    if (parts.length > 1 && r.repeat > 1 && take * r.repeat <= n && n + (put - take) * r.repeat <= 400) reps = r.repeat;
    const body = parts.length === 0 ? 'k to end' : reps > 1 ? `(${parts.join(', ')}) ${reps} times, k to end` : `${parts.join(', ')}, k to end`;
    const last = put === take ? round + r.span - 1 : round;
    lines.push(last > round ? `rounds ${round}-${last}: ${body}` : `round ${round}: ${body}`);
    n += (put - take) * reps;
    round = last + 1;
  }
  const rounds = round - 1;
  if (p.ladder && rounds >= 2) {
    const from = Math.min(p.ladder.from, rounds - 1);
    const to = Math.min(from + p.ladder.span, rounds);
    if (to > from) lines.push(`ladder B every ${p.ladder.every} from round ${from} to ${to}`);
  }
  return lines.join('\n');
}
