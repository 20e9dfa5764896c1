/**
 * Operations in words: turns the operations of a round line (AST, graded
 * numbers resolved for one size) into the trade's usual written form, and
 * collects the abbreviations used for the key.
 *
 * Conventions (the trade's usual phrasing; wording our own):
 * - counts run into the stitch: "k5", "p2", "sl1 wyif"; a decrease or
 *   increase worked several times: "k2tog 3 times";
 * - a group worked a number of times: "[k2, p2] 12 times";
 * - a group worked to a place: "*k2, p2; rep from * to end" (or "to last
 *   2 sts", "to marker"); nested groups use square brackets;
 * - a yarn other than the line's: "k3 with B".
 */
import type { Graded, Op, ToSpec } from '../notation';

/** An abbreviation used, with its meaning (for the key). */
export interface KeyEntry { abbreviation: string; meaning: string }

/** Meanings of the words the instructions use besides the stitches (our own wording). */
export const WORD_MEANINGS: Readonly<Record<string, string>> = {
  rnd: 'round', rnds: 'rounds', st: 'stitch', sts: 'stitches', RS: 'right side', WS: 'wrong side',
  rep: 'repeat', pm: 'place marker', rm: 'remove marker', m: 'marker', bst: 'backing stitch (behind the fabric; it takes no width)',
  'set up bst': 'set up a backing stitch: bring the front yarn forward, work a lifted increase in the named yarn behind it, take the front yarn back',
  'work bst': 'work a backing stitch: bring the front yarn forward, knit the backing stitch in its own yarn, take the front yarn back',
  'close bst': 'close a backing stitch: knit it together with the front stitch beside it (k2tog)',
  'close bst ssk': 'close a backing stitch: work it together with the front stitch beside it as an ssk',
  catch: 'catch the float of the named yarn behind the next stitch',
};

/** What phrasing needs to know about the size and the round. */
export interface PhraseContext {
  /** Resolves a graded number for the size. */
  graded: (g: Graded) => number;
  /** The line's yarn (a stitch in another yarn says so). */
  lineYarn: string;
  /** Default yarn of the pattern. */
  defaultYarn: string;
  /** Chart row worked by a chart operation on this round (null when unknown). */
  chartRow: (op: Extract<Op, { type: 'chart' }>) => number | null;
  /** Abbreviations met so far (filled in). */
  used: Map<string, string>;
  /** Flat work (charts read RS rows right to left, WS rows left to right); default in the round. */
  flat?: boolean;
  /** Write the yarn of every stitch that names one, even the line's own (lines that mix yarns). */
  namesEveryYarn?: boolean;
  /** Meaning of a stitch name (STITCHES). */
  stitchMeaning: (name: string) => string;
}

const COUNT_INTO_WORD = new Set(['k', 'p', 'sl', 'sl wyif', 'k tbl', 'p tbl', 'co', 'bo']);

function use(ctx: PhraseContext, abbr: string, meaning?: string): void {
  if (!ctx.used.has(abbr)) ctx.used.set(abbr, meaning ?? WORD_MEANINGS[abbr] ?? ctx.stitchMeaning(abbr));
}

/** "to end", "to last 2 sts", "to marker", "to marker gusset". */
export function toPhrase(to: ToSpec, ctx: PhraseContext): string {
  if (to.kind === 'end') return 'to end';
  if (to.kind === 'last') {
    const n = ctx.graded(to.n);
    use(ctx, n === 1 ? 'st' : 'sts');
    return `to last ${n} ${n === 1 ? 'st' : 'sts'}`;
  }
  use(ctx, 'm');
  return to.name ? `to m ${to.name.name}` : 'to m';
}

function stitchWord(name: string, count: number | null): string {
  if (count === null) return name;
  if (COUNT_INTO_WORD.has(name)) {
    const [word, mod] = name.split(' ');
    return mod ? `${word}${count} ${mod}` : `${word}${count}`;
  }
  return count === 1 ? name : `${name} ${count} times`;
}

function withYarn(text: string, yarn: string | null, ctx: PhraseContext): string {
  if (!yarn) return text;
  return yarn !== ctx.lineYarn || ctx.namesEveryYarn ? `${text} with ${yarn}` : text;
}

/** True when some operation of the list (at any depth) names its yarn: then every named yarn is written, "k1 with A, k1 with B". */
export function namesYarns(ops: readonly Op[]): boolean {
  return ops.some((o) => (o.type === 'stitch' || o.type === 'cable') ? o.yarn !== null && ops.length > 1 : o.type === 'group' ? namesYarns(o.ops) : false);
}

/** One operation in words. `depth` counts enclosing groups. */
export function opPhrase(op: Op, ctx: PhraseContext, depth = 0): string {
  switch (op.type) {
    case 'stitch': {
      const name = op.stitch.name;
      use(ctx, name, ctx.stitchMeaning(name));
      if ((name === 'bo' || name === 'co') && op.count) {
        const n = ctx.graded(op.count);
        use(ctx, n === 1 ? 'st' : 'sts');
        return withYarn(`${name} ${n} ${n === 1 ? 'st' : 'sts'}`, op.yarn?.name ?? null, ctx);
      }
      if (op.to) return withYarn(`${stitchWord(name, null)} ${toPhrase(op.to, ctx)}`, op.yarn?.name ?? null, ctx);
      const n = op.count ? ctx.graded(op.count) : null;
      const shown = n === null && COUNT_INTO_WORD.has(name) ? stitchWord(name, 1) : stitchWord(name, n);
      return withYarn(shown, op.yarn?.name ?? null, ctx);
    }
    case 'group': {
      const inner = { ...ctx, lineYarn: op.yarn?.name ?? ctx.lineYarn };
      const body = op.ops.map((o) => opPhrase(o, inner, depth + 1)).join(', ');
      const yarnNote = op.yarn && op.yarn.name !== ctx.lineYarn ? ` with ${op.yarn.name}` : '';
      if (op.repeat.kind === 'once') return `${body}${yarnNote}`;
      if (op.repeat.kind === 'times') {
        const n = ctx.graded(op.repeat.n);
        const only = op.ops.length === 1 ? op.ops[0] : null;
        // A chart worked once, a number of times: "work row 3 of chart lantern twice".
        if (only?.type === 'chart' && only.once && !yarnNote) return body.replace(/ once$/, ` ${n === 1 ? 'once' : n === 2 ? 'twice' : `${n} times`}`);
        return `[${body}]${yarnNote} ${n === 1 ? 'once' : n === 2 ? 'twice' : `${n} times`}`;
      }
      use(ctx, 'rep');
      if (depth === 0) return `*${body}${yarnNote}; rep from * ${toPhrase(op.repeat, ctx)}`;
      return `[${body}]${yarnNote} ${toPhrase(op.repeat, ctx)}`;
    }
    case 'chart': {
      const row = ctx.chartRow(op);
      const which = row === null ? `chart ${op.chart.name}` : `row ${row} of chart ${op.chart.name}`;
      use(ctx, `chart ${op.chart.name}`, ctx.flat
        ? `the chart named ${op.chart.name}: read RS rows from right to left and WS rows from left to right; row 1 is the bottom row`
        : `the chart named ${op.chart.name}: read every round from right to left; row 1 is the bottom row`);
      return op.once ? `work ${which} once` : `work ${which} to end, repeating it across`;
    }
    case 'mark': use(ctx, 'pm'); return `pm ${op.name.name}`;
    case 'unmark': use(ctx, 'rm'); return `rm ${op.name.name}`;
    case 'catch': use(ctx, 'catch'); return `catch ${op.yarn.name}`;
    case 'raise': use(ctx, 'bst'); use(ctx, 'set up bst'); return `set up bst in ${op.yarn.name}`;
    case 'carry': {
      use(ctx, 'bst'); use(ctx, 'work bst');
      const n = op.count ? ctx.graded(op.count) : 1;
      return n === 1 ? 'work bst' : `work bst ${n} times`;
    }
    case 'close': {
      use(ctx, 'bst');
      if (op.how === 'ssk') { use(ctx, 'close bst ssk'); return 'close bst ssk'; }
      use(ctx, 'close bst');
      return 'close bst';
    }
    case 'cable': {
      const abbr = `${op.held}/${op.worked} ${op.dir === 'left' ? 'LC' : 'RC'}`;
      use(ctx, abbr, `cable: slip ${op.held} st${op.held === 1 ? '' : 's'} to a cable needle and hold in ${op.dir === 'left' ? 'front' : 'back'}, k${op.worked}, then k${op.held} from the cable needle`);
      return withYarn(abbr, op.yarn?.name ?? null, ctx);
    }
  }
}

/** A whole operation list in words. */
export function opsPhrase(ops: readonly Op[], ctx: PhraseContext): string {
  return ops.map((o) => opPhrase(o, ctx, 0)).join(', ');
}
