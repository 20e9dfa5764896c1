/**
 * Header resolution: sizes, construction, gauge, yarns and float limit with
 * defaults filled in, plus the header checks (LW502 colours too alike, LW504
 * unusable gauge or limit). Uses shared/measure for gauge and colour maths.
 */
import type { Diagnostic, PatternHeader, Span } from '../types';
import type { HeaderAst } from '../notation';
import { makeDiagnostic } from '../diagnostics';
import { DEFAULT_ALIKE_THRESHOLD, DEFAULT_FLOAT_LIMIT, findAlikeColours, floatLimitInStitches, tryNormalizeGauge, type Gauge } from '../measure';

/** The name of the single size of a pattern that declares no sizes. */
export const ONE_SIZE = 'one size';
/** The yarn a pattern without yarn lines is worked in. */
export const DEFAULT_YARN = 'main';

/** The header as the checker uses it. */
export interface ResolvedHeader {
  header: PatternHeader;
  /** Size names to build (never empty). */
  sizes: string[];
  /** Yarn names by index; index 0 is the default yarn. */
  yarns: string[];
  yarnIndex: Map<string, number>;
  gauge: Gauge | null;
  /** Longest float allowed, in front stitches (null without a gauge). */
  floatLimitStitches: number | null;
  /** Stitches per inch (null without a gauge). */
  stitchesPerInch: number | null;
}

/** Resolves the header, appending its diagnostics to `out`. */
export function resolveHeader(h: HeaderAst, out: Diagnostic[], origin: Span): ResolvedHeader {
  const yarnsDeclared = h.yarns.map((y) => ({ name: y.name.name, label: y.label, colour: y.colour }));
  const floatLimit = h.floatLimit && h.floatLimit.value > 0 ? { value: h.floatLimit.value, unit: h.floatLimit.unit } : { ...DEFAULT_FLOAT_LIMIT };
  if (h.floatLimit && !(h.floatLimit.value > 0)) {
    out.push(makeDiagnostic('LW504', h.floatLimit.span, { detail: 'a float limit must be more than 0; using 1 in' }));
  }
  let declared: PatternHeader['gauge'] = null;
  let gauge: Gauge | null = null;
  if (h.gauge) {
    const { stitches, rows, length, unit, span } = h.gauge;
    const basis = unit === 'cm' ? 10 : 4;
    const scale = length > 0 ? basis / length : NaN;
    const decl = { stitches: stitches * scale, rows: rows * scale, per: unit === 'cm' ? ('10cm' as const) : ('4in' as const) };
    const outcome = tryNormalizeGauge(decl);
    if (outcome.ok) { gauge = outcome.value; declared = decl; } else out.push(makeDiagnostic('LW504', span, { detail: `the gauge cannot be used: ${outcome.problem.message}` }));
  }
  const header: PatternHeader = {
    title: h.title?.value ?? null,
    designer: h.designer?.value ?? null,
    item: resolveItem(h.item, out),
    sizes: (h.sizes ?? []).map((s) => s.name),
    construction: h.construction?.value ?? 'round',
    gauge: declared,
    yarns: yarnsDeclared,
    floatLimit,
  };
  const yarns = yarnsDeclared.length ? yarnsDeclared.map((y) => y.name) : [DEFAULT_YARN];
  for (const pair of findAlikeColours(yarnsDeclared, DEFAULT_ALIKE_THRESHOLD)) {
    const second = h.yarns.find((y) => y.name.name === pair.second);
    out.push(makeDiagnostic('LW502', second?.colourSpan ?? origin, {
      first: pair.first, second: pair.second, deltaE: pair.deltaE.toFixed(1), threshold: DEFAULT_ALIKE_THRESHOLD,
    }));
  }
  return {
    header,
    sizes: header.sizes.length ? header.sizes : [ONE_SIZE],
    yarns,
    yarnIndex: new Map(yarns.map((n, i) => [n, i])),
    gauge,
    floatLimitStitches: gauge ? floatLimitInStitches(floatLimit, gauge) : null,
    stitchesPerInch: gauge ? gauge.stitchesPerInch : null,
  };
}

/** Item words the trade uses, by the body measurement they are compared with. */
const ITEM_WORDS: Record<string, 'hat' | 'hand'> = {
  hat: 'hat', hats: 'hat', beanie: 'hat', toque: 'hat', cap: 'hat',
  mitt: 'hand', mitts: 'hand', mitten: 'hand', mittens: 'hand', glove: 'hand', gloves: 'hand', hand: 'hand',
};

/** The `item` line as a body-measurement kind; an unknown word is LW214 and gives null. */
function resolveItem(item: { word: string; span: Span } | null, out: Diagnostic[]): 'hat' | 'hand' | null {
  if (!item) return null;
  const kind = ITEM_WORDS[item.word.toLowerCase()];
  if (kind) return kind;
  out.push(makeDiagnostic('LW214', item.span, { word: item.word, known: 'hat, mitts, gloves' }));
  return null;
}
