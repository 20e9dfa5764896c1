/**
 * The catalogue of diagnostic codes. Codes are stable and never reused;
 * grammar/diagnostics.md documents each with a paragraph. A diagnostic is
 * data first (code, span, facts) and prose second: {@link formatDiagnostic}
 * is the single place where facts become a message and a hint.
 *
 * Prefix "LW"; hundreds group the stage: 1xx reading the text, 2xx names and
 * header, 3xx stitch counts, 4xx backing stitches, 5xx floats and colour,
 * 9xx limits.
 */
import type { Severity } from '../types';

/** Facts a message is built from; each code documents the keys it uses. */
export type Facts = Record<string, string | number>;

/** One code: the comment above each entry in the list is its title (grammar/diagnostics.md has the paragraph). */
export interface CodeInfo {
  code: string;
  severity: Severity;
  message: (f: Facts) => string;
  hint?: (f: Facts) => string | undefined;
}

const s = (n: string | number, one: string, many = `${one}s`) => `${n} ${Number(n) === 1 ? one : many}`;
const where = (f: Facts) => (f.segment ? ` in segment ${f.segment}` : '');
/** " (size M)" for a finding of one size of several. */
const sized = (f: Facts) => (f.size ? ` (size ${f.size})` : '');
const isAre = (n: string | number) => (Number(n) === 1 ? 'is' : 'are');

const list: CodeInfo[] = [
  // Unreadable characters
  { code: 'LW101', severity: 'error',
    message: (f) => `cannot read ${f.text}`, hint: () => 'stitch words, numbers, names, "quoted text", #rrggbb colours and |chart rows| are what a source is made of' },
  // Unexpected word
  { code: 'LW102', severity: 'error', message: (f) => String(f.detail),
    hint: (f) => (f.hint ? String(f.hint) : undefined) },
  // Not a usable number
  { code: 'LW103', severity: 'error',
    message: (f) => `${f.what} must be ${f.need}, not ${f.value}` },
  // Unknown stitch combination
  { code: 'LW104', severity: 'error',
    message: (f) => `'${f.text}' is not a stitch the notation knows`, hint: (f) => (f.hint ? String(f.hint) : undefined) },
  // Graded list does not match the sizes
  { code: 'LW201', severity: 'error',
    message: (f) => `this graded number has ${s(f.count, 'value')} but the pattern has ${s(f.sizes, 'size')}`,
    hint: (f) => `write one value per size (${f.sizeNames}), separated by '/'` },
  // Unknown yarn
  { code: 'LW202', severity: 'error',
    message: (f) => `there is no yarn called ${f.name}`, hint: (f) => (f.suggest ? `did you mean ${f.suggest}?` : `declare it: yarn ${f.name} "label" #rrggbb`) },
  // Unknown chart
  { code: 'LW203', severity: 'error',
    message: (f) => `there is no chart called ${f.name}`, hint: (f) => (f.suggest ? `did you mean ${f.suggest}?` : `define it with a block "chart ${f.name}:", its key and its rows`) },
  // Unknown segment
  { code: 'LW204', severity: 'error',
    message: (f) => `round ${f.round} has no segment called ${f.name}${sized(f)}`,
    hint: (f) => (f.known ? `segments on the needle then: ${f.known}` : 'a segment starts at a marker placed with "mark NAME"') },
  // Unknown marker
  { code: 'LW205', severity: 'error',
    message: (f) => `round ${f.round} reaches no marker called ${f.name}${sized(f)}`,
    hint: (f) => (f.known ? `markers on the needle: ${f.known}` : 'place it first with "mark NAME"') },
  // Declared twice
  { code: 'LW206', severity: 'error',
    message: (f) => `${f.what} ${f.name} is declared twice`, hint: () => 'give each one its own name' },
  // Missing cast on
  { code: 'LW207', severity: 'error',
    message: () => 'the pattern never casts on', hint: () => 'add a line such as: cast on 96' },
  // Unknown size
  { code: 'LW208', severity: 'error',
    message: (f) => `there is no size ${f.name}`, hint: (f) => `sizes: ${f.known}` },
  // Round without instructions
  { code: 'LW209', severity: 'error',
    message: (f) => `${f.word}${f.through > f.round ? `s ${f.round} to ${f.through} have` : ` ${f.round} has`} no instructions${sized(f)}`,
    hint: (f) => `${f.word}s are worked from 1 to ${f.last}; write ${f.word}${f.through > f.round ? `s ${f.round}-${f.through}` : ` ${f.round}`} or widen a range` },
  // Chart key problem
  { code: 'LW210', severity: 'error', message: (f) => String(f.detail),
    hint: (f) => (f.hint ? String(f.hint) : undefined) },
  // Mixed whole-round and segment instructions
  { code: 'LW211', severity: 'error',
    message: (f) => `${f.word} ${f.round} has instructions for the whole round and for segment ${f.segment}`,
    hint: () => 'give every segment its own line for these rounds, or none' },
  // Ladder range
  { code: 'LW212', severity: 'error',
    message: (f) => `a ladder needs at least two rounds: set up on the first and closed on the last (got ${f.first}-${f.last})` },
  // Wrong side word
  { code: 'LW213', severity: 'warning',
    message: (f) => `this pattern is worked ${f.construction} but the line says ${f.word}`,
    hint: (f) => `write ${f.expected}` },
  // Unknown item
  { code: 'LW214', severity: 'warning',
    message: (f) => `"${f.word}" is not an item the finished size can be compared for`,
    hint: (f) => `write one of ${f.known}, or leave the item line out` },
  // Count does not match the needle
  { code: 'LW301', severity: 'error',
    message: (f) => `${f.word} ${f.round}${where(f)} works ${s(f.worked, 'stitch', 'stitches')} but ${f.onNeedle} ${isAre(f.onNeedle)} on the needle${sized(f)}`,
    hint: (f) => {
      const d = Number(f.onNeedle) - Number(f.worked);
      return d > 0 ? `work ${s(d, 'more stitch', 'more stitches')}, or end with "k to end"` : `work ${s(-d, 'stitch', 'stitches')} fewer`;
    } },
  // Repeat does not fit
  { code: 'LW302', severity: 'error',
    message: (f) => `${f.word} ${f.round}${where(f)}: a repeat of ${s(f.repeat, 'stitch', 'stitches')} does not fit into ${f.available}, ${s(f.over, 'stitch', 'stitches')} left over${sized(f)}`,
    hint: (f) => `add ${s(Number(f.repeat) - Number(f.over), 'stitch', 'stitches')}, take away ${f.over}, or change the repeat` },
  // Too few stitches for the stitch
  { code: 'LW303', severity: 'error',
    message: (f) => `${f.word} ${f.round}${where(f)}: ${f.stitch} needs ${f.needs} stitches but only ${f.left} ${isAre(f.left)} left${sized(f)}` },
  // Chart row wider than its segment
  { code: 'LW304', severity: 'error',
    message: (f) => `chart ${f.chart} row ${f.row} is ${s(f.width, 'stitch', 'stitches')} wide but only ${f.available} ${isAre(f.available)} left in ${f.word} ${f.round}${where(f)}${sized(f)}` },
  // Segment without instructions
  { code: 'LW305', severity: 'error',
    message: (f) => `${f.word} ${f.round}: segment ${f.segment} (${s(f.stitches, 'stitch', 'stitches')}) has no instructions${sized(f)}`,
    hint: (f) => `add a line "${f.word}s ... at ${f.segment}: ..." for this ${f.word}` },
  // Repeat that works no stitches
  { code: 'LW306', severity: 'error',
    message: () => 'this repeat works no stitches, so it cannot be repeated to the end or to a marker', hint: () => 'give it a fixed number of times' },
  // Marker not reached
  { code: 'LW307', severity: 'error',
    message: (f) => `${f.word} ${f.round}: ${f.detail}${sized(f)}` },
  // Backing stitch not worked
  { code: 'LW401', severity: 'error',
    message: (f) => `${f.word} ${f.round}: ${f.stitch} meets a backing stitch in ${f.yarn} and works it as a front stitch${sized(f)}`,
    hint: () => 'work it with "carry" (or let a ladder line work it), or close it with "close"' },
  // Backing stitch closed twice
  { code: 'LW402', severity: 'error',
    message: (f) => `${f.word} ${f.round}: this backing stitch was already closed in ${f.word} ${f.closedIn}${sized(f)}` },
  // Backing stitch closed without a neighbour
  { code: 'LW403', severity: 'error',
    message: (f) => `${f.word} ${f.round}: ${f.detail}${sized(f)}`,
    hint: () => 'a backing stitch closes together with the front stitch beside it (close = k2tog, close ssk)' },
  // Backing stitch never closed
  { code: 'LW404', severity: 'error',
    message: (f) => `${s(f.count, 'backing stitch', 'backing stitches')} in ${f.yarn} set up here ${isAre(f.count)} still on the needle after the last ${f.word}${sized(f)}`,
    hint: () => 'close each one with "close" (or end the ladder) before the last round' },
  // Nothing to close or carry
  { code: 'LW405', severity: 'error',
    message: (f) => `${f.word} ${f.round}: ${f.detail}${sized(f)}` },
  // Float longer than the limit
  { code: 'LW501', severity: 'warning',
    message: (f) => `${f.rounds}: yarn ${f.yarn} floats behind ${f.stitches} stitches (${f.inches} in / ${f.cm} cm), longer than the ${f.limit} limit${sized(f)}`,
    hint: (f) => `catch ${f.yarn} every ${f.every} stitches or fewer, or add a backing column` },
  // Yarn colours too alike
  { code: 'LW502', severity: 'warning',
    message: (f) => `yarns ${f.first} and ${f.second} are hard to tell apart in a chart (colour difference ${f.deltaE}, below ${f.threshold})`,
    hint: () => 'choose colours further apart in lightness or hue' },
  // No gauge: floats in stitches only
  { code: 'LW503', severity: 'info',
    message: () => 'there is no gauge, so floats are not measured against the float limit', hint: () => 'add a line such as: gauge 28 sts and 32 rounds per 10 cm' },
  // Unusable colour or gauge
  { code: 'LW504', severity: 'error', message: (f) => String(f.detail) },
  // Pattern too large
  { code: 'LW901', severity: 'error',
    message: (f) => `${f.detail}${sized(f)}; stopped working further ${f.word}s`,
    hint: () => 'check for a repeat count or round number with too many digits' },
  // More problems not shown
  { code: 'LW902', severity: 'info',
    message: (f) => `${f.count} more problems of this kind (${f.code}) are not listed` },
];

/** Every code, by code. */
export const CODES: ReadonlyMap<string, CodeInfo> = new Map(list.map((c) => [c.code, c]));
/** Every code in catalogue order (for docs and tests). */
export const CODE_LIST: readonly CodeInfo[] = list;
