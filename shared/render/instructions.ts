/**
 * Written instructions for one size: one entry per round, or per run of
 * consecutive rounds that read the same and keep the same count ("Rnds
 * 5–12: k to end."), with the stitch count after every round that changes
 * it, front and backing ("29 sts: 24 + 5 backing"), the backing stitches
 * written out for the knitter, the round notes, and a key of the
 * abbreviations used.
 *
 * Inputs: the source (its AST gives the wording of each line) and the
 * compile result of the same source (it gives the rounds worked, the lines
 * each round used and the counts). Pure; never throws on user input.
 *
 * Invariants:
 * - entries cover rounds 1..N of the size in order, each round once;
 * - `counts` is present on an entry exactly when its first round's counts
 *   differ from the round before (the cast-on before round 1), and then
 *   equals the checker's counts for every round of the entry.
 */
import type { CompileResult, Span } from '../index';
import { FLAG, type RoundRecord, type StitchLevel } from '../check';
import { parseSource, STITCHES, type Graded, type LadderLine, type PatternAst, type RoundLine } from '../notation';
import { ordinal } from '../measure';
import { groupRounds, type RoundWords } from './grouping';
import { namesYarns, opsPhrase, WORD_MEANINGS, type KeyEntry, type PhraseContext } from './phrases';

/** Counts after a round. */
export interface StitchCounts { front: number; backing: number; total: number }

/** One entry of the instructions. */
export interface InstructionEntry {
  first: number;
  last: number;
  /** The side of a single row (flat work); null in the round or for a range. */
  side: 'RS' | 'WS' | null;
  /** "Rnd 7", "Rnds 5–12", "Row 2 (WS)". */
  label: string;
  /** What to do, one or more sentences. */
  text: string;
  note: string | null;
  /** Counts after the entry's rounds when they change; null when unchanged. */
  counts: StitchCounts | null;
  /** The source line of the entry's first round. */
  span: Span;
}

/** Instructions of one size. */
export interface Instructions {
  title: string | null;
  size: string;
  construction: 'round' | 'flat';
  /** The opening sentence: cast-on (and join for work in the round). */
  castOn: string;
  castOnCount: number;
  entries: InstructionEntry[];
  /** Abbreviations used, in order of first use. */
  key: KeyEntry[];
}

const meaningOf = (name: string) => STITCHES.find((s) => s.name === name)?.meaning ?? name;

/** Formats counts: "60 sts" or "60 sts: 56 + 4 backing". */
export function formatCounts(c: StitchCounts): string {
  return c.backing > 0 ? `${c.total} sts: ${c.front} + ${c.backing} backing` : `${c.total} sts`;
}

/** Writes the instructions of `size` (default: the first size); null when the result has no such size. */
export function writeInstructions(source: string, result: CompileResult, size?: string): Instructions | null {
  const model = size === undefined ? result.sizes[0] : result.sizes.find((s) => s.name === size);
  if (!model) return null;
  const { ast } = parseSource(source);
  const header = result.header;
  const sizeIndex = Math.max(0, header.sizes.indexOf(model.name));
  const graded = (g: Graded) => (g.values.length === 1 ? g.values[0] : g.values[sizeIndex] ?? g.values[0]);
  const flat = header.construction === 'flat';
  const defaultYarn = header.yarns[0]?.name ?? model.stitches.yarns[0] ?? '';
  const used = new Map<string, string>();
  const lineByFrom = new Map<number, RoundLine>(ast.rounds.map((l) => [l.span.from, l]));
  const chartHeight = new Map(ast.charts.map((c) => [c.name.name, c.rows.length]));
  const word = flat ? 'Row' : 'Rnd';
  const mark = (abbr: string) => { if (!used.has(abbr)) used.set(abbr, WORD_MEANINGS[abbr] ?? abbr); };

  const perRound = model.stitches.rounds.map((rec) => {
    const parts: string[] = [];
    for (const src of rec.lines) {
      const span = model.stitches.sources[src];
      const line = span ? lineByFrom.get(span.from) : undefined;
      if (!line) continue;
      const lineYarn = line.yarn?.name ?? defaultYarn;
      const ctx: PhraseContext = {
        graded, lineYarn, defaultYarn, used, stitchMeaning: meaningOf, namesEveryYarn: namesYarns(line.ops), flat,
        chartRow: (op) => {
          if (op.row) return graded(op.row);
          const h = chartHeight.get(op.chart.name);
          return h ? ((rec.number - graded(line.first)) % h) + 1 : null;
        },
      };
      let text = opsPhrase(line.ops, ctx);
      if (line.yarn && line.yarn.name !== defaultYarn) text = `with ${line.yarn.name}, ${text}`;
      if (line.segment) text = `${line.segment.name} section: ${text}`;
      parts.push(text);
    }
    let text = parts.length ? sentence(parts.join('; ')) : 'No instructions for this round (see the problems).';
    const ladder = ladderSentences(ast, rec.number, graded, used, (l) => raisedAfter(model.stitches, rec, l), flat ? 'row' : 'rnd');
    if (ladder) text += ` ${ladder}`;
    return { rec, text };
  });

  mark(flat ? 'RS' : 'rnd');
  if (flat) mark('WS');
  mark('sts');
  const words: RoundWords[] = perRound.map(({ rec, text }) => ({ number: rec.number, side: rec.side, text, note: rec.note, front: rec.front, backing: rec.backing, span: rec.span }));
  const entries: InstructionEntry[] = groupRounds(words, model.castOn, flat).map((g) => ({
    ...g,
    label: g.first === g.last ? `${word} ${g.first}${g.side ? ` (${g.side})` : ''}` : `${word}s ${g.first}–${g.last}`,
  }));
  if (entries.some((e) => e.text.startsWith('Rep '))) mark('rep');
  const castOnYarn = ast.castOn?.yarn?.name ?? defaultYarn;
  const castOn = flat
    ? `Cast on ${model.castOn} sts with ${castOnYarn}. Row 1 is a right-side (RS) row.`
    : `Cast on ${model.castOn} sts with ${castOnYarn}. Join to work in the round, taking care not to twist the sts; the beginning of the round is where the cast-on ends.`;
  return {
    title: header.title, size: model.name, construction: header.construction, castOn, castOnCount: model.castOn, entries,
    key: [...used].map(([abbreviation, meaning]) => ({ abbreviation, meaning })),
  };
}

/** First letter up, full stop at the end. */
function sentence(s: string): string {
  const t = s.trim();
  const up = t.charAt(0).toUpperCase() + t.slice(1);
  return /[.!?]$/.test(up) ? up : `${up}.`;
}

/** What the ladder lines ask of round `n`, written out for the knitter. */
function ladderSentences(ast: PatternAst, n: number, graded: (g: Graded) => number, used: Map<string, string>, raised: (l: LadderLine) => number[], unit: string): string {
  const out: string[] = [];
  for (const l of ast.ladders) {
    const first = graded(l.first), last = graded(l.last);
    if (!(first >= 1 && last > first) || n < first || n > last) continue;
    if (!used.has('bst')) used.set('bst', WORD_MEANINGS.bst);
    out.push(ladderPhase(l, n === first ? 'setup' : n === last ? 'close' : 'work', raised(l), unit));
  }
  return out.join(' ');
}

/**
 * Where a ladder's backing stitches were set up in round `rec`, as front
 * stitches worked before each, counted from the beginning of the round
 * (read from the model, so the words match what the checker worked).
 */
function raisedAfter(level: StitchLevel, rec: RoundRecord, l: LadderLine): number[] {
  const out: number[] = [];
  let front = 0;
  for (let i = rec.offset; i < rec.offset + rec.count; i++) {
    const f = level.store.flags[i];
    if (!(f & FLAG.BACKING)) { front++; continue; }
    if ((f & FLAG.MANAGED) && level.ops[level.store.op[i]].kind === 'raise' && level.sources[level.store.src[i]]?.from === l.span.from) out.push(front);
  }
  return out;
}

/** "after the 3rd front st and every 6th front st after it (8 bst)" or a list. */
function describePositions(at: readonly number[]): string {
  if (at.length === 0) return 'nowhere (the stretch is too short)';
  if (at.length === 1) return `after the ${ordinal(at[0])} front st (1 bst)`;
  const step = at[1] - at[0];
  const even = at.every((v, i) => i === 0 || v - at[i - 1] === step);
  if (even && at.length > 2) return `after the ${ordinal(at[0])} front st and then after every ${ordinal(step)} front st, to the ${ordinal(at[at.length - 1])} (${at.length} bst)`;
  return `after front sts ${at.join(', ')} (${at.length} bst)`;
}

function ladderPhase(l: LadderLine, phase: 'setup' | 'work' | 'close', raised: readonly number[], unit: string): string {
  const where = l.segment ? ` in the ${l.segment.name} section` : '';
  const yarn = l.yarn.name;
  if (phase === 'setup') {
    return `At the same time, set up bst in ${yarn}, counting front sts from the beginning of the ${unit}, ${describePositions(raised)}: for each, bring the front yarn forward, work a lifted increase in ${yarn} behind it, take the front yarn back.`;
  }
  if (phase === 'work') {
    return `Work each bst${where} as you reach it (front yarn forward, k the bst with ${yarn}, front yarn back); the counts above are front sts only.`;
  }
  return l.close === 'ssk'
    ? `Close each bst${where} as you reach it: ssk it together with the front st after it.`
    : `Close each bst${where} as you reach it: k2tog it together with the front st after it.`;
}

/** Plain text: title, size, cast-on, one line per entry with its counts and note, then the key. */
export function formatInstructionsText(ins: Instructions): string {
  const lines: string[] = [];
  lines.push(`${ins.title ?? 'Untitled pattern'}: ${ins.size === 'one size' ? 'one size' : `size ${ins.size}`}`);
  lines.push('');
  lines.push(ins.castOn);
  lines.push('');
  for (const e of ins.entries) {
    let line = `${e.label}: ${e.text}`;
    if (e.counts) line += ` (${formatCounts(e.counts)})`;
    if (e.note) line += ` Note: ${e.note}`;
    lines.push(line);
  }
  lines.push('');
  lines.push('Key');
  for (const k of ins.key) lines.push(`  ${k.abbreviation}: ${k.meaning}`);
  return `${lines.join('\n')}\n`;
}
