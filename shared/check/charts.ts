/**
 * Chart preparation: each chart block becomes rows of cells ready to work.
 * Row 1 is the bottom row as drawn (the last written); every row must be as
 * wide as the others and use only characters of the key (LW210); key yarns
 * must exist (LW202). Cells without a stitch in the key are knit (on a WS
 * row, purled: a symbol shows the stitch as it looks on the right side).
 */
import type { ChartBlock } from '../notation';
import { OP, STITCHES, stitchByName, type StitchInfo } from '../notation';
import type { Reporter } from './context';
import { closestName } from '../diagnostics';
import type { ResolvedHeader } from './header';
import type { SourceTable } from './sources';

/** One cell ready to work. */
export interface Cell {
  /** Worked on a RS row. */
  rs: StitchInfo;
  /** Worked on a WS row (knit and purl swapped). */
  ws: StitchInfo;
  /** Yarn index, or -1 for the round's yarn. */
  yarn: number;
  /** No-stitch cell: skipped. */
  none: boolean;
}

/** One chart row. */
export interface ChartRow {
  cells: Cell[];
  /** Stitches the row takes from the needle. */
  consumes: number;
  /** Stitches it puts on the needle. */
  produces: number;
  /** Source index of the row's line. */
  src: number;
  /**
   * True when every cell takes one stitch and gives one (no-stitch cells
   * aside): the machine may then write the row in one go. `rs`/`ws` hold the
   * worked cells in working order (op code, yarn index or -1).
   */
  simple: boolean;
  rs: { op: Uint8Array; yarn: Int16Array };
  ws: { op: Uint8Array; yarn: Int16Array };
}

/** A chart ready to work. rows[0] is row 1 (the bottom row as drawn). */
export interface PreparedChart {
  name: string;
  width: number;
  rows: ChartRow[];
}

const wsSwap: Record<string, string> = { k: 'p', p: 'k', 'k tbl': 'p tbl', 'p tbl': 'k tbl', k2tog: 'p2tog', p2tog: 'k2tog', ssk: 'ssp', ssp: 'ssk' };

/** The stitch a cell works on the wrong side (knit and purl swapped). */
export function wrongSide(s: StitchInfo): StitchInfo {
  const other = wsSwap[s.name];
  return other ? stitchByName(other)! : s;
}

/**
 * How a stitch worked on `side` looks from the right side: a purl worked on
 * a WS row shows as a knit stitch (and k2tog/p2tog, ssk/ssp likewise). The
 * model stores stitches as worked; renderers call this for RS symbols.
 */
export function asSeenFromRightSide(s: StitchInfo, side: 'RS' | 'WS'): StitchInfo {
  return side === 'WS' ? wrongSide(s) : s;
}

/** Prepares every chart; problems go to the reporter. */
export function prepareCharts(charts: readonly ChartBlock[], head: ResolvedHeader, rep: Reporter, sources: SourceTable): Map<string, PreparedChart> {
  const out = new Map<string, PreparedChart>();
  const knit = STITCHES[OP.k];
  for (const c of charts) {
    const keys = new Map<string, Cell>();
    for (const k of c.keys) {
      if (keys.has(k.char)) {
        rep.report('LW210', k.span, { detail: `chart ${c.name.name} has two keys for '${k.char}'` });
        continue;
      }
      let yarn = -1;
      if (k.yarn) {
        const i = head.yarnIndex.get(k.yarn.name);
        if (i === undefined) rep.report('LW202', k.yarn.span, { name: k.yarn.name, suggest: closestName(k.yarn.name, head.yarnIndex.keys()) ?? '' });
        else yarn = i;
      }
      const st = k.stitch ?? knit;
      keys.set(k.char, { rs: st, ws: wrongSide(st), yarn, none: k.none });
    }
    const width = c.rows[0]?.cells.length ?? 0;
    const rows: ChartRow[] = [];
    // Written top to bottom; row 1 is the last line written.
    for (let r = c.rows.length - 1; r >= 0; r--) {
      const row = c.rows[r];
      if (row.cells.length !== width) {
        rep.report('LW210', row.span, { detail: `chart ${c.name.name}: this row has ${row.cells.length} cells but the first row has ${width}`, hint: 'every chart row is the same width; use a no-stitch key for cells that are not worked' });
      }
      const cells: Cell[] = [];
      let consumes = 0, produces = 0;
      for (const ch of row.cells) {
        const cell = keys.get(ch);
        if (!cell) {
          rep.report('LW210', row.span, { detail: `chart ${c.name.name}: '${ch}' is not in its key`, hint: `add: key "${ch}" A` }, undefined, ch);
          cells.push({ rs: knit, ws: wrongSide(knit), yarn: -1, none: false });
          consumes++; produces++;
          continue;
        }
        cells.push(cell);
        if (!cell.none) { consumes += cell.rs.consumes; produces += cell.rs.produces; }
      }
      const worked = cells.filter((x) => !x.none);
      const rsOrder = [...worked].reverse(); // RS rows are read right to left
      const pack = (list: Cell[], ws: boolean) => ({
        op: Uint8Array.from(list.map((x) => (ws ? x.ws : x.rs).code)),
        yarn: Int16Array.from(list.map((x) => x.yarn)),
      });
      rows.push({
        cells, consumes, produces, src: sources.add(row.span),
        simple: worked.every((x) => x.rs.consumes === 1 && x.rs.produces === 1 && x.ws.consumes === 1 && x.ws.produces === 1),
        rs: pack(rsOrder, false), ws: pack(worked, true),
      });
    }
    out.set(c.name.name, { name: c.name.name, width, rows });
  }
  return out;
}
