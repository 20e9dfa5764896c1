/**
 * The summary of a compiled pattern: per-round counts for every size,
 * finished circumference or width and length from the gauge, a yarn
 * estimate per colour (labelled an estimate, with its assumption, and
 * calibratable with a swatch), the float report, the Craft Yarn Council
 * weight category of the declared gauge, finished size against body
 * measurements when the caller says what the item is, and the trade's
 * cautions. All arithmetic comes from shared/measure.
 *
 * Invariants: every size of the result appears once, in order; lengths are
 * given in both cm and in (1 in = 2.54 cm exactly); without a gauge no
 * length, estimate or float length is given (null), only counts.
 */
import type { CompileResult } from '../index';
import type { SizeModel } from '../check';
import {
  calibrateFromSwatch, classifyYarnWeight, compareToBody, estimateYarn, finishedSize, stitchesToLength, suitableWearers, tryNormalizeGauge,
  type BodyComparison, type BodyItem, type DualLength, type FinishedSize, type Gauge, type StitchLengthModel, type SwatchMeasurement, type Wearer,
  type YarnEstimate, type YarnWeightClassification,
} from '../measure';
import { floatLimitFromHeader } from './chart-model';
import { roundFloats } from './float-lines';

/** One line of the float report: the longest float of a yarn in a round (the checker's measure, catches included). */
export interface FloatReportEntry { round: number; yarn: string; stitches: number; length: DualLength | null; isOverLimit: boolean }

/** The summary of one size. */
export interface SizeSummary {
  name: string;
  castOn: number;
  rounds: { number: number; side: 'RS' | 'WS'; front: number; backing: number; total: number }[];
  /** The front count worked over the most rounds: the size's main width. */
  mainFrontStitches: number;
  /** Finished size at the main front count and over the rounds worked (null without a gauge). */
  finished: FinishedSize | null;
  /** Rounds (rows) worked with stitches on the needle at the end. */
  roundsWorked: number;
  yarn: YarnEstimate | null;
  floats: FloatReportEntry[];
  /** Against body measurements, when the caller named the item (see SummaryOptions.item). */
  body: { item: BodyItem; comparisons: BodyComparison[]; suits: Wearer[] } | null;
}

/** The whole summary. */
export interface PatternSummary {
  title: string | null;
  construction: 'round' | 'flat';
  gauge: Gauge | null;
  yarnWeight: YarnWeightClassification | null;
  floatLimitStitches: number | null;
  sizes: SizeSummary[];
  /** The assumption behind the yarn estimate, in one paragraph. */
  yarnAssumption: string | null;
  /** What could not be said, and why. */
  gaps: string[];
  /** General guidance of the trade (not safety certification). */
  cautions: string[];
}

/** Options of {@link summarize}. */
export interface SummaryOptions {
  /** A swatch to calibrate the yarn estimate (shared/measure calibrateFromSwatch). */
  swatch?: SwatchMeasurement;
  /** Allowance on top of the estimate, a fraction; default 10 % (shared/measure). */
  allowance?: number;
  /** Metres per 100 g from each yarn's ball band, by yarn name, to give grams. */
  metresPer100g?: Readonly<Record<string, number>>;
  /**
   * What the item is: a hat or a hand (mitts, gloves). Defaults to the
   * pattern's `item` line (PatternHeader.item). Without either, no body comparison.
   */
  item?: BodyItem;
}

const WEARERS: Readonly<Record<BodyItem, Wearer[]>> = { hat: ['baby', 'toddler', 'child', 'adult'], hand: ['child', 'woman', 'man'] };

/** Summarises a compile result. Never throws on user input. */
export function summarize(result: CompileResult, given: SummaryOptions = {}): PatternSummary {
  const { header } = result;
  // The pattern's own `item` line says what it is unless the caller overrides it.
  const options: SummaryOptions = { ...given, item: given.item ?? header.item ?? undefined };
  const gaps: string[] = [];
  const g = header.gauge ? tryNormalizeGauge(header.gauge) : null;
  const gauge = g && g.ok ? g.value : null;
  if (!gauge) gaps.push('No usable gauge is declared, so there are no lengths, no yarn estimate and no float lengths in cm or in.');
  const yarnWeight = gauge ? classifyYarnWeight(gauge) : null;
  const limit = floatLimitFromHeader(result);
  let stitchLength = undefined as ReturnType<typeof calibrateFromSwatch> | undefined;
  if (options.swatch) {
    stitchLength = calibrateFromSwatch(options.swatch);
    if (!stitchLength.ok) gaps.push(`The swatch could not be used: ${stitchLength.problem.message}`);
  }
  let assumption: string | null = null;
  const sizes = result.sizes.map((s) => {
    const sum = summarizeSize(s, result, gauge, limit, options, stitchLength && stitchLength.ok ? stitchLength.value : undefined);
    if (sum.yarn && !assumption) assumption = sum.yarn.model.assumption;
    return sum;
  });
  if (!options.item) gaps.push('The pattern does not say what the item is (add a line such as `item hat` or `item mitts`), so the finished size is not compared with body measurements.');
  const longest = Math.max(0, ...sizes.flatMap((s) => s.floats.map((f) => f.stitches)));
  const longestLen = gauge && longest > 0 ? stitchesToLength(longest, gauge) : null;
  const cautions = [
    'If the item is worn, state the fibre content of each yarn and its care (washing, drying, pressing) as the care labels give it; follow the labelling rules where the pattern or the finished item is sold.',
    `If the item is made for a baby or a toddler, keep floats short and caught, since long floats can snag small fingers and loops can be a strangling hazard, and avoid small parts that can come off; the longest float in this pattern is ${longest} st${longest === 1 ? '' : 's'}${longestLen ? ` (${fmt(longestLen.cm)} cm, ${fmt(longestLen.in)} in)` : ''}.`,
    'This is the general guidance of the trade, not a safety certification: local rules for children\'s products and labelling come first.',
  ];
  return {
    title: header.title, construction: header.construction, gauge, yarnWeight, floatLimitStitches: limit, sizes,
    yarnAssumption: assumption, gaps, cautions,
  };
}

function summarizeSize(s: SizeModel, result: CompileResult, gauge: Gauge | null, limit: number | null, options: SummaryOptions, stitchLength: StitchLengthModel | undefined): SizeSummary {
  const level = s.stitches;
  const flat = result.header.construction === 'flat';
  // The main width: the front count worked over the most rounds (the cast-on counts as one).
  const tally = new Map<number, number>([[s.castOn, 1]]);
  for (const r of s.rounds) tally.set(r.front, (tally.get(r.front) ?? 0) + 1);
  let main = s.castOn, best = 0;
  for (const [front, n] of tally) if (front > 0 && (n > best || (n === best && front > main))) { main = front; best = n; }
  const roundsWorked = s.rounds.filter((r) => r.total > 0).length;
  const finished = gauge ? finishedSize({ frontStitches: main, rows: roundsWorked, construction: result.header.construction }, gauge) : null;

  // Yarn: every stitch put on the needle is a loop made in its yarn (a k2tog makes one), plus the cast-on;
  // floats add their width.
  const loops = new Map<number, number>();
  const floatWidth = new Map<number, number>();
  const count = (from: number, to: number) => { for (let i = from; i < to; i++) loops.set(level.store.yarn[i], (loops.get(level.store.yarn[i]) ?? 0) + 1); };
  count(0, s.castOn);
  // Rounds may share a slice of the store (identical rounds): count each round's own stitches.
  for (const rec of level.rounds) count(rec.offset, rec.offset + rec.count);
  for (const rec of level.rounds) {
    for (const f of roundFloats(level, rec.offset, rec.count, !flat)) floatWidth.set(f.yarn, (floatWidth.get(f.yarn) ?? 0) + f.stitches);
  }
  let yarn: YarnEstimate | null = null;
  if (gauge) {
    const usages = level.yarns.map((name, y) => ({
      yarn: name, stitches: loops.get(y) ?? 0, floatStitches: floatWidth.get(y) ?? 0,
      ...(options.metresPer100g?.[name] ? { metresPer100g: options.metresPer100g[name] } : {}),
    })).filter((u) => u.stitches > 0);
    const est = estimateYarn(usages, gauge, { ...(stitchLength ? { stitchLength } : {}), ...(options.allowance !== undefined ? { allowance: options.allowance } : {}) });
    yarn = est.ok ? est.value : null;
  }

  const floats: FloatReportEntry[] = [];
  for (const rec of level.rounds) {
    for (const f of [...rec.floats].sort((a, b) => a.yarn - b.yarn)) {
      floats.push({
        round: rec.number, yarn: level.yarns[f.yarn] ?? '', stitches: f.stitches,
        length: gauge ? stitchesToLength(f.stitches, gauge) : null, isOverLimit: limit !== null && f.stitches > limit,
      });
    }
  }
  let body: SizeSummary['body'] = null;
  if (options.item && finished) {
    const comparisons = WEARERS[options.item].map((w) => compareToBody(finished.width, options.item!, w)).filter((c): c is BodyComparison => c !== null);
    body = { item: options.item, comparisons, suits: suitableWearers(finished.width, options.item) };
  }
  return {
    name: s.name, castOn: s.castOn,
    rounds: s.rounds.map((r) => ({ number: r.number, side: r.side, front: r.front, backing: r.backing, total: r.total })),
    mainFrontStitches: main, finished, roundsWorked, yarn, floats, body,
  };
}

function fmt(n: number, digits = 1): string {
  const t = n.toFixed(digits);
  return t.includes('.') ? t.replace(/\.?0+$/, '') : t;
}
