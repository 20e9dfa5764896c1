/**
 * Chart symbols: which symbol a stitch gets on the chart, what the legend
 * says about it, and how it is drawn (SVG path data in a unit cell, 0..1 on
 * both axes, y down).
 *
 * The chart shows every stitch as it looks on the RIGHT side (common practice
 * in published chart-reading guides). The checker records the stitch
 * actually worked on each side (a knit cell is purled on a WS row), so a
 * WS stitch is mapped back to its right-side appearance with
 * {@link rightSideName}: a purl worked on a WS row is a knit cell.
 *
 * The symbols of ordinary stitches follow the trade's usual conventions
 * (knit blank, purl dot, decreases drawn as a line leaning the way the
 * decrease leans, yarn over a circle, slip a V). The backing-stitch symbols
 * (set up, carried, closed) are Loopwright's own design.
 */

/** Identifier of a chart symbol. Closed union. */
export type SymbolId =
  | 'knit' | 'purl' | 'knit-tbl' | 'purl-tbl' | 'slip' | 'slip-wyif' | 'yo'
  | 'm1' | 'm1l' | 'm1r' | 'lli' | 'rli' | 'kfb' | 'pfb'
  | 'k2tog' | 'ssk' | 'p2tog' | 'ssp' | 'skpo' | 'k3tog' | 'sssk' | 'cdd' | 'sk2p'
  | 'cast-on' | 'bind-off' | 'cable-left' | 'cable-right'
  | 'backing-raise' | 'backing-carry' | 'close-k2tog' | 'close-ssk'
  | 'unworked' | 'no-stitch';

/** How a symbol is drawn and explained. */
export interface SymbolDef {
  readonly id: SymbolId;
  /** The abbreviation shown in the legend ("k2tog"); empty for no-stitch. */
  readonly abbreviation: string;
  /** What the cell means, on the right side, in our own words. */
  readonly meaning: string;
  /** Stroked path data in a unit cell (stroke width is set by the renderer). */
  readonly stroke: string;
  /** Filled path data in a unit cell. */
  readonly fill: string;
}

const dot = (cx: number, cy: number, r: number): string =>
  `M${cx - r} ${cy}a${r} ${r} 0 1 0 ${2 * r} 0a${r} ${r} 0 1 0 ${-2 * r} 0Z`;
const tri = 'M0.5 0.12L0.82 0.78H0.18Z';

const DEFS: readonly SymbolDef[] = [
  { id: 'knit', abbreviation: 'k', meaning: 'knit on RS, purl on WS', stroke: '', fill: '' },
  { id: 'purl', abbreviation: 'p', meaning: 'purl on RS, knit on WS', stroke: '', fill: dot(0.5, 0.5, 0.13) },
  { id: 'knit-tbl', abbreviation: 'k tbl', meaning: 'knit through the back loop on RS, purl through the back loop on WS', stroke: 'M0.5 0.88V0.5M0.5 0.5C0.2 0.5 0.2 0.14 0.5 0.14C0.8 0.14 0.8 0.5 0.5 0.5', fill: '' },
  { id: 'purl-tbl', abbreviation: 'p tbl', meaning: 'purl through the back loop on RS, knit through the back loop on WS', stroke: 'M0.5 0.7V0.45M0.5 0.45C0.25 0.45 0.25 0.14 0.5 0.14C0.75 0.14 0.75 0.45 0.5 0.45', fill: dot(0.5, 0.84, 0.08) },
  { id: 'slip', abbreviation: 'sl', meaning: 'slip purlwise with the yarn on the wrong side (wyib on RS, wyif on WS)', stroke: 'M0.22 0.2L0.5 0.82L0.78 0.2', fill: '' },
  { id: 'slip-wyif', abbreviation: 'sl wyif', meaning: 'slip purlwise with the yarn on the right side (wyif on RS, wyib on WS)', stroke: 'M0.22 0.14L0.5 0.7L0.78 0.14M0.2 0.86H0.8', fill: '' },
  { id: 'yo', abbreviation: 'yo', meaning: 'yarn over', stroke: 'M0.22 0.5a0.28 0.28 0 1 0 0.56 0a0.28 0.28 0 1 0 -0.56 0', fill: '' },
  { id: 'm1', abbreviation: 'm1', meaning: 'make one', stroke: 'M0.2 0.8V0.22L0.5 0.55L0.8 0.22V0.8', fill: '' },
  { id: 'm1l', abbreviation: 'm1l', meaning: 'make one leaning left', stroke: 'M0.22 0.82V0.2L0.78 0.82', fill: '' },
  { id: 'm1r', abbreviation: 'm1r', meaning: 'make one leaning right', stroke: 'M0.78 0.82V0.2L0.22 0.82', fill: '' },
  { id: 'lli', abbreviation: 'lli', meaning: 'left lifted increase', stroke: 'M0.7 0.84L0.3 0.2M0.3 0.2L0.3 0.46M0.3 0.2L0.54 0.28', fill: '' },
  { id: 'rli', abbreviation: 'rli', meaning: 'right lifted increase', stroke: 'M0.3 0.84L0.7 0.2M0.7 0.2L0.7 0.46M0.7 0.2L0.46 0.28', fill: '' },
  { id: 'kfb', abbreviation: 'kfb', meaning: 'knit into the front and back of the stitch (two cells)', stroke: 'M0.5 0.86V0.5L0.2 0.16M0.5 0.5L0.8 0.16', fill: '' },
  { id: 'pfb', abbreviation: 'pfb', meaning: 'purl into the front and back of the stitch (two cells)', stroke: 'M0.5 0.7V0.45L0.2 0.14M0.5 0.45L0.8 0.14', fill: dot(0.5, 0.86, 0.07) },
  { id: 'k2tog', abbreviation: 'k2tog', meaning: 'knit two together (leans right)', stroke: 'M0.18 0.84L0.82 0.16', fill: '' },
  { id: 'ssk', abbreviation: 'ssk', meaning: 'slip, slip, knit together (leans left)', stroke: 'M0.18 0.16L0.82 0.84', fill: '' },
  { id: 'p2tog', abbreviation: 'p2tog', meaning: 'purl two together (leans right)', stroke: 'M0.18 0.84L0.82 0.16', fill: dot(0.72, 0.68, 0.08) },
  { id: 'ssp', abbreviation: 'ssp', meaning: 'slip, slip, purl together (leans left)', stroke: 'M0.18 0.16L0.82 0.84', fill: dot(0.28, 0.68, 0.08) },
  { id: 'skpo', abbreviation: 'skpo', meaning: 'slip one, knit one, pass the slipped stitch over (leans left)', stroke: 'M0.18 0.16L0.82 0.84M0.18 0.16H0.46', fill: '' },
  { id: 'k3tog', abbreviation: 'k3tog', meaning: 'knit three together (leans right)', stroke: 'M0.14 0.84L0.7 0.16M0.34 0.84L0.88 0.18', fill: '' },
  { id: 'sssk', abbreviation: 'sssk', meaning: 'slip, slip, slip, knit together (leans left)', stroke: 'M0.86 0.84L0.3 0.16M0.66 0.84L0.12 0.18', fill: '' },
  { id: 'cdd', abbreviation: 'cdd', meaning: 'centred double decrease', stroke: 'M0.18 0.84L0.5 0.16L0.82 0.84M0.5 0.16V0.84', fill: '' },
  { id: 'sk2p', abbreviation: 'sk2p', meaning: 'slip one, knit two together, pass the slipped stitch over (leans left)', stroke: 'M0.18 0.84L0.5 0.16L0.82 0.84M0.3 0.6H0.7', fill: '' },
  { id: 'cast-on', abbreviation: 'co', meaning: 'cast on a stitch within the round', stroke: 'M0.2 0.8H0.8M0.5 0.8V0.24', fill: '' },
  { id: 'bind-off', abbreviation: 'bo', meaning: 'bind off', stroke: '', fill: 'M0.2 0.38H0.8V0.62H0.2Z' },
  { id: 'cable-left', abbreviation: 'cable left', meaning: 'part of a cable crossing to the left', stroke: 'M0.86 0.86L0.14 0.14M0.14 0.86L0.4 0.6', fill: '' },
  { id: 'cable-right', abbreviation: 'cable right', meaning: 'part of a cable crossing to the right', stroke: 'M0.14 0.86L0.86 0.14M0.86 0.86L0.6 0.6', fill: '' },
  { id: 'backing-raise', abbreviation: 'raise', meaning: 'set up a backing stitch: a lifted increase in its yarn, front yarn held forward', stroke: '', fill: tri },
  { id: 'backing-carry', abbreviation: 'carry', meaning: 'backing stitch: knit it in its own yarn with the front yarn held forward', stroke: 'M0.5 0.1V0.9M0.3 0.3L0.5 0.1L0.7 0.3', fill: '' },
  { id: 'close-k2tog', abbreviation: 'close', meaning: 'close the backing stitch: work it together with its neighbour (k2tog)', stroke: 'M0.18 0.84L0.82 0.16', fill: 'M0.5 0.9L0.7 0.62H0.3Z' },
  { id: 'close-ssk', abbreviation: 'close ssk', meaning: 'close the backing stitch: work it together with its neighbour (ssk)', stroke: 'M0.18 0.16L0.82 0.84', fill: 'M0.5 0.9L0.7 0.62H0.3Z' },
  { id: 'unworked', abbreviation: '?', meaning: 'left unworked because the count does not add up (see the problems)', stroke: 'M0.2 0.2L0.8 0.8M0.8 0.2L0.2 0.8', fill: '' },
  { id: 'no-stitch', abbreviation: '', meaning: 'no stitch: skip this cell', stroke: '', fill: '' },
];

/** Every symbol, in legend order. */
export const SYMBOLS: readonly SymbolDef[] = DEFS;
const byId = new Map<SymbolId, SymbolDef>(DEFS.map((d) => [d.id, d]));

/** The definition of a symbol. */
export function symbolDef(id: SymbolId): SymbolDef {
  return byId.get(id)!;
}

// What a stitch worked on a WS row looks like on the RS (the reverse of
// shared/check/charts.ts wrongSide; the trade's convention).
const RS_OF_WS: Readonly<Record<string, string>> = {
  k: 'p', p: 'k', 'k tbl': 'p tbl', 'p tbl': 'k tbl', k2tog: 'p2tog', p2tog: 'k2tog', ssk: 'ssp', ssp: 'ssk',
  kfb: 'pfb', pfb: 'kfb',
  // A slip with the yarn in front of a WS row leaves the strand on the wrong side, as a RS slip wyib does.
  sl: 'sl wyif', 'sl wyif': 'sl',
};

/** The stitch as it looks on the right side, given what was worked on `side`. */
export function rightSideName(worked: string, side: 'RS' | 'WS'): string {
  return side === 'WS' ? (RS_OF_WS[worked] ?? worked) : worked;
}

const BY_NAME: Readonly<Record<string, SymbolId>> = {
  k: 'knit', p: 'purl', 'k tbl': 'knit-tbl', 'p tbl': 'purl-tbl', sl: 'slip', 'sl wyif': 'slip-wyif', yo: 'yo',
  m1: 'm1', m1l: 'm1l', m1r: 'm1r', lli: 'lli', rli: 'rli', kfb: 'kfb', pfb: 'pfb',
  k2tog: 'k2tog', ssk: 'ssk', p2tog: 'p2tog', ssp: 'ssp', skpo: 'skpo', k3tog: 'k3tog', sssk: 'sssk', cdd: 'cdd', sk2p: 'sk2p',
  co: 'cast-on', bo: 'bind-off', 'cable left': 'cable-left', 'cable right': 'cable-right',
  raise: 'backing-raise', carry: 'backing-carry', 'close k2tog': 'close-k2tog', 'close ssk': 'close-ssk',
};

/**
 * The symbol of a stitch worked with operation `worked` (a STITCHES name) on
 * `side`. Stitches of the cast-on that carry into round 1 are knit cells.
 */
export function symbolFor(worked: string, side: 'RS' | 'WS', isUnworked: boolean): SymbolId {
  if (isUnworked) return 'unworked';
  return BY_NAME[rightSideName(worked, side)] ?? 'knit';
}
