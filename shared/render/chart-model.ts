/**
 * The chart model of one size: a grid of cells (one per stitch on the
 * needle after each round, aligned in columns by columns.ts), the markers,
 * the floats for the back view and the legend. Pure data; chart-svg.ts and
 * back-svg.ts draw it, the studio may draw it its own way.
 *
 * Invariants:
 * - `rows[i].cells.length === width` for every row; `null` is a no-stitch cell.
 * - The cells of a row that are not null are exactly the stitches on the
 *   needle after that round (front + backing), each once, plus one
 *   bind-off cell per stitch the round bound off.
 * - Rows are in working order: rows[0] is round/row 1 (drawn at the bottom),
 *   or the first round of `options.rounds`.
 * - x is counted from the LEFT edge as drawn (x = width - 1 - position from the right).
 */
import type { CompileResult, Span } from '../index';
import type { SizeModel } from '../check';
import { FLAG } from '../check';
import { floatLimitInStitches, symbolInk, tryNormalizeGauge } from '../measure';
import { layoutColumns } from './columns';
import { roundFloats } from './float-lines';
import { SYMBOLS, symbolFor, type SymbolId } from './symbols';

/** One cell of the chart. */
export interface ChartCell {
  /** Index of the stitch in its round, in working order (0 = first worked). */
  stitch: number;
  /** The operation worked (STITCHES name, e.g. "k2tog"), as worked on that side. */
  worked: string;
  /** The symbol: the stitch as it looks on the right side. */
  symbol: SymbolId;
  /** Yarn short name and colour ('#rrggbb'). */
  yarn: string;
  colour: string;
  /** Symbol ink chosen by contrast against the yarn colour. */
  ink: '#000000' | '#ffffff';
  isBacking: boolean;
  /** A stitch bound off in this round (it leaves the needle; `stitch` is -1). */
  isBoundOff: boolean;
  /** The source text that produced the stitch (null for stitches carried from the cast-on). */
  span: Span | null;
}

/** A marker of a row: a line between two cells, at `x` cell widths from the chart's left edge. */
export interface ChartMarker { name: string; x: number }

/**
 * A float line of the back view, in chart coordinates (cells x1..x2
 * inclusive, as drawn). `stitches` counts the front stitches between two
 * stitches or backing stitches of the yarn. Explicit `catch` operations are
 * not in the model: when the checker's longest float for this yarn and round
 * is shorter than `stitches`, the float is broken by catches we cannot place
 * (`isCaught`), and `caughtLongest` is the checker's longest.
 */
export interface ChartFloat {
  yarn: string; colour: string; stitches: number; isOverLimit: boolean;
  isCaught: boolean; caughtLongest: number | null;
  pieces: { x1: number; x2: number }[];
}

/** One round or row of the chart. */
export interface ChartRow {
  number: number;
  side: 'RS' | 'WS';
  /** The side the row is read from: in the round always 'right'; flat, RS 'right', WS 'left'. */
  readFrom: 'right' | 'left';
  cells: (ChartCell | null)[];
  front: number;
  backing: number;
  markers: ChartMarker[];
  floats: ChartFloat[];
  note: string | null;
  span: Span;
}

/** A legend line: a symbol used in the chart. */
export interface LegendEntry { symbol: SymbolId }

/** The chart of one size. */
export interface ChartModel {
  title: string | null;
  size: string;
  construction: 'round' | 'flat';
  width: number;
  rows: ChartRow[];
  /** Symbols used (no-stitch included when any cell is empty), in SYMBOLS order. */
  legend: SymbolId[];
  yarns: { name: string; label: string; colour: string }[];
  /** Longest float allowed, in stitches (null without a gauge). */
  floatLimitStitches: number | null;
}

/** Options of {@link buildChart}. */
export interface ChartOptions {
  /** Float limit in stitches for highlighting; default: from the header and gauge, else none. */
  floatLimitStitches?: number | null;
  /** Only these rounds (rows), inclusive, for a window of a long chart; default all. Columns stay those of the whole chart. */
  rounds?: { first: number; last: number };
}

const FALLBACK_COLOUR = '#ffffff';

/**
 * Builds the chart model of `size` (default: the first size). Returns null
 * when the result has no such size (the caller reports it).
 */
export function buildChart(result: CompileResult, size?: string, options: ChartOptions = {}): ChartModel | null {
  const model: SizeModel | undefined = size === undefined ? result.sizes[0] : result.sizes.find((s) => s.name === size);
  if (!model) return null;
  const { header } = result;
  const flat = header.construction === 'flat';
  const level = model.stitches;
  const layout = layoutColumns(level, model.castOn, flat);
  const colourOf = new Map(header.yarns.map((y) => [y.name, y.colour]));
  const inkOf = new Map<string, '#000000' | '#ffffff'>();
  const ink = (colour: string) => {
    let v = inkOf.get(colour);
    if (!v) { v = symbolInk(colour).hex; inkOf.set(colour, v); }
    return v;
  };
  const limit = options.floatLimitStitches !== undefined ? options.floatLimitStitches : floatLimitFromHeader(result);
  const used = new Set<SymbolId>();
  let hasEmpty = false;
  const width = layout.width;
  const inWindow = (n: number) => !options.rounds || (n >= options.rounds.first && n <= options.rounds.last);
  const rows: ChartRow[] = [];
  level.rounds.forEach((rec, r) => {
    if (!inWindow(rec.number)) return;
    const pos = layout.positions[r];
    const xOf = (stitch: number) => width - 1 - pos[stitch];
    const cells: (ChartCell | null)[] = new Array<ChartCell | null>(width).fill(null);
    for (let s = 0; s < rec.count; s++) {
      const i = rec.offset + s;
      const flags = level.store.flags[i];
      const yarn = level.yarns[level.store.yarn[i]] ?? '';
      const colour = colourOf.get(yarn) ?? FALLBACK_COLOUR;
      const symbol = symbolFor(level.ops[level.store.op[i]].name, rec.side, (flags & FLAG.UNWORKED) !== 0);
      used.add(symbol);
      const src = level.store.src[i];
      cells[xOf(s)] = {
        stitch: s, worked: level.ops[level.store.op[i]].name, symbol, yarn, colour, ink: ink(colour),
        isBacking: (flags & FLAG.BACKING) !== 0, isBoundOff: false, span: level.sources[src] ?? null,
      };
    }
    for (const b of layout.boundOff[r]) {
      const yarn = level.yarns[level.store.yarn[b.stitch]] ?? '';
      const colour = colourOf.get(yarn) ?? FALLBACK_COLOUR;
      used.add('bind-off');
      cells[width - 1 - b.position] = {
        stitch: -1, worked: 'bo', symbol: 'bind-off', yarn, colour, ink: ink(colour), isBacking: false, isBoundOff: true, span: rec.span,
      };
    }
    if (cells.some((c) => c === null)) hasEmpty = true;
    const markers: ChartMarker[] = rec.markers
      .filter((m) => m.at > 0 && m.at < rec.count)
      .map((m) => ({ name: m.name, x: rec.side === 'RS' ? xOf(m.at - 1) : xOf(m.at - 1) + 1 }));
    const checked = new Map(rec.floats.map((f) => [f.yarn, f.stitches]));
    const floats: ChartFloat[] = roundFloats(level, rec.offset, rec.count, !flat).map((f) => {
      const yarn = level.yarns[f.yarn] ?? '';
      const longest = checked.get(f.yarn) ?? 0;
      const isCaught = f.stitches > longest;
      return {
        yarn, colour: colourOf.get(yarn) ?? FALLBACK_COLOUR, stitches: f.stitches,
        isOverLimit: !isCaught && limit !== null && f.stitches > limit, isCaught, caughtLongest: isCaught ? longest : null,
        pieces: f.pieces.map((p) => {
          const a = xOf(p.from - rec.offset), b = xOf(p.to - rec.offset);
          return { x1: Math.min(a, b), x2: Math.max(a, b) };
        }),
      };
    });
    rows.push({
      number: rec.number, side: rec.side, readFrom: flat && rec.side === 'WS' ? 'left' : 'right', cells,
      front: rec.front, backing: rec.backing, markers, floats, note: rec.note, span: rec.span,
    });
  });
  if (hasEmpty) used.add('no-stitch');
  const legend = SYMBOLS.map((d) => d.id).filter((id) => used.has(id));
  return {
    title: header.title, size: model.name, construction: header.construction, width, rows, legend,
    yarns: header.yarns.map((y) => ({ ...y })), floatLimitStitches: limit,
  };
}

/** The float limit in stitches from the header's limit and gauge (shared/measure), or null without a usable gauge. */
export function floatLimitFromHeader(result: CompileResult): number | null {
  const g = result.header.gauge;
  if (!g) return null;
  const gauge = tryNormalizeGauge(g);
  if (!gauge.ok) return null;
  const n = floatLimitInStitches(result.header.floatLimit, gauge.value);
  return Number.isFinite(n) ? n : null;
}
