/**
 * Reads written instructions back for their counts, the way a knitter
 * would: each line "Rnd 5: ..." or "Rnds 5–12: ..." covers those rounds;
 * a trailing "(60 sts)" or "(60 sts: 56 + 4 backing)" is the count after
 * them; a line without one keeps the count from before (the cast-on at the
 * start). Used to check the instructions against the checker.
 */
export interface ParsedCounts { castOn: number; rounds: { number: number; front: number; backing: number; total: number }[] }

export function parseInstructionCounts(text: string): ParsedCounts {
  const castOn = Number(/Cast on (\d+) sts/.exec(text)?.[1] ?? NaN);
  let front = castOn, backing = 0;
  const rounds: ParsedCounts['rounds'] = [];
  for (const line of text.split('\n')) {
    const head = /^(?:Rnds?|Rows?) (\d+)(?:–(\d+))?(?: \((?:RS|WS)\))?: /.exec(line);
    if (!head) continue;
    const first = Number(head[1]), last = Number(head[2] ?? head[1]);
    const count = /\((\d+) sts(?:: (\d+) \+ (\d+) backing)?\)(?: Note: .*)?$/.exec(line);
    if (count) {
      const total = Number(count[1]);
      backing = count[3] ? Number(count[3]) : 0;
      front = count[2] ? Number(count[2]) : total;
      if (front + backing !== total) throw new Error(`counts do not add up in "${line}"`);
    }
    for (let n = first; n <= last; n++) rounds.push({ number: n, front, backing, total: front + backing });
  }
  return { castOn, rounds };
}
