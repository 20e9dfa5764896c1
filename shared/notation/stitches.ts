/**
 * The stitch table: every operation word of the notation with what it takes
 * from the left needle and what it puts on the right needle.
 *
 * Counts follow the trade's published abbreviation lists (see
 * grammar/reference.md): k, p, sl, tbl: 0 net; k2tog, ssk, p2tog, ssp, skpo: -1;
 * k3tog, sssk, cdd, sk2p: -2; yo, m1, m1l, m1r, lli, rli, kfb, pfb: +1.
 * The `code` of an entry is its index in {@link STITCHES}; the compiled model
 * stores these codes per stitch (see shared/check/README.md).
 */

/** How an operation is treated by the stitch machine. */
export type StitchKind =
  | 'plain' // ordinary front-fabric stitch work
  | 'increase'
  | 'decrease'
  | 'cast-on' // new stitches made within a round (count = stitches made)
  | 'bind-off' // stitches bound off within a round (count = stitches removed)
  | 'cable'
  | 'raise' // set up a backing stitch (lifted increase in the travelling yarn, front yarn forward)
  | 'carry' // work a backing stitch in its own yarn, front yarn forward then back
  | 'close'; // close a backing stitch by working it together with a front neighbour

/** One operation of the stitch table. */
export interface StitchInfo {
  /** Index in STITCHES; stored per stitch in the model. */
  readonly code: number;
  /** Canonical word, as written in sources and instructions. */
  readonly name: string;
  /** Stitches taken from the left needle per working. */
  readonly consumes: number;
  /** Stitches put on the right needle per working. */
  readonly produces: number;
  readonly kind: StitchKind;
  /** What the knitter does, in plain trade words (for instructions and docs). */
  readonly meaning: string;
}

const table: Omit<StitchInfo, 'code'>[] = [
  { name: 'k', consumes: 1, produces: 1, kind: 'plain', meaning: 'knit' },
  { name: 'p', consumes: 1, produces: 1, kind: 'plain', meaning: 'purl' },
  { name: 'k tbl', consumes: 1, produces: 1, kind: 'plain', meaning: 'knit through the back loop' },
  { name: 'p tbl', consumes: 1, produces: 1, kind: 'plain', meaning: 'purl through the back loop' },
  { name: 'sl', consumes: 1, produces: 1, kind: 'plain', meaning: 'slip purlwise with yarn in back' },
  { name: 'sl wyif', consumes: 1, produces: 1, kind: 'plain', meaning: 'slip purlwise with yarn in front' },
  { name: 'yo', consumes: 0, produces: 1, kind: 'increase', meaning: 'yarn over' },
  { name: 'm1', consumes: 0, produces: 1, kind: 'increase', meaning: 'make one' },
  { name: 'm1l', consumes: 0, produces: 1, kind: 'increase', meaning: 'make one left' },
  { name: 'm1r', consumes: 0, produces: 1, kind: 'increase', meaning: 'make one right' },
  { name: 'lli', consumes: 0, produces: 1, kind: 'increase', meaning: 'left lifted increase' },
  { name: 'rli', consumes: 0, produces: 1, kind: 'increase', meaning: 'right lifted increase' },
  { name: 'kfb', consumes: 1, produces: 2, kind: 'increase', meaning: 'knit into the front and back of the stitch' },
  { name: 'pfb', consumes: 1, produces: 2, kind: 'increase', meaning: 'purl into the front and back of the stitch' },
  { name: 'k2tog', consumes: 2, produces: 1, kind: 'decrease', meaning: 'knit two together' },
  { name: 'ssk', consumes: 2, produces: 1, kind: 'decrease', meaning: 'slip, slip, knit the two together' },
  { name: 'p2tog', consumes: 2, produces: 1, kind: 'decrease', meaning: 'purl two together' },
  { name: 'ssp', consumes: 2, produces: 1, kind: 'decrease', meaning: 'slip, slip, purl the two together' },
  { name: 'skpo', consumes: 2, produces: 1, kind: 'decrease', meaning: 'slip one, knit one, pass the slipped stitch over' },
  { name: 'k3tog', consumes: 3, produces: 1, kind: 'decrease', meaning: 'knit three together' },
  { name: 'sssk', consumes: 3, produces: 1, kind: 'decrease', meaning: 'slip, slip, slip, knit the three together' },
  { name: 'cdd', consumes: 3, produces: 1, kind: 'decrease', meaning: 'centred double decrease' },
  { name: 'sk2p', consumes: 3, produces: 1, kind: 'decrease', meaning: 'slip one, knit two together, pass the slipped stitch over' },
  { name: 'co', consumes: 0, produces: 1, kind: 'cast-on', meaning: 'cast on' },
  { name: 'bo', consumes: 1, produces: 0, kind: 'bind-off', meaning: 'bind off' },
  { name: 'cable left', consumes: 1, produces: 1, kind: 'cable', meaning: 'cable crossing to the left' },
  { name: 'cable right', consumes: 1, produces: 1, kind: 'cable', meaning: 'cable crossing to the right' },
  { name: 'raise', consumes: 0, produces: 1, kind: 'raise', meaning: 'set up a backing stitch' },
  { name: 'carry', consumes: 1, produces: 1, kind: 'carry', meaning: 'work the backing stitch in its own yarn' },
  { name: 'close k2tog', consumes: 2, produces: 1, kind: 'close', meaning: 'close the backing stitch: k2tog it with its neighbour' },
  { name: 'close ssk', consumes: 2, produces: 1, kind: 'close', meaning: 'close the backing stitch: ssk it with its neighbour' },
];

/** Every operation, indexed by code. */
export const STITCHES: readonly StitchInfo[] = table.map((s, code) => ({ ...s, code }));

const byName = new Map<string, StitchInfo>(STITCHES.map((s) => [s.name, s]));

/** Looks an operation up by its canonical name ("k2tog", "sl wyif"). */
export function stitchByName(name: string): StitchInfo | undefined {
  return byName.get(name);
}

/** Codes used directly by the machine (stable: they are indexes of the table above). */
export const OP = {
  k: 0, p: 1, ktbl: 2, ptbl: 3, sl: 4, slWyif: 5, yo: 6,
  co: 23, bo: 24, cableLeft: 25, cableRight: 26,
  raise: 27, carry: 28, closeK2tog: 29, closeSsk: 30,
} as const;

/**
 * Stitch words a source may write, longest first so the lexer prefers
 * "k2tog" over "k" followed by "2". A word may carry a count suffix ("k5").
 */
export const STITCH_WORDS: readonly string[] = [
  'k2tog', 'k3tog', 'p2tog', 'sssk', 'ssk', 'ssp', 'skpo', 'sk2p', 'cdd',
  'kfb', 'pfb', 'ktbl', 'ptbl', 'm1l', 'm1r', 'm1', 'lli', 'rli', 'yo', 'sl', 'co', 'bo', 'k', 'p',
];

/** Modifier words written after a stitch ("k1 tbl", "sl1 wyif"). */
export const MODIFIER_WORDS: readonly string[] = ['tbl', 'wyif', 'wyib'];

/**
 * Resolves a stitch word plus an optional modifier to a table entry.
 * Returns undefined for combinations the trade does not use ("k2tog wyif").
 */
export function resolveStitch(word: string, modifier: string | null): StitchInfo | undefined {
  const w = word.toLowerCase();
  const m = modifier?.toLowerCase() ?? null;
  if (w === 'ktbl' || w === 'ptbl') return m === null ? byName.get(w === 'ktbl' ? 'k tbl' : 'p tbl') : undefined;
  if (m === null) return byName.get(w);
  if (m === 'tbl' && (w === 'k' || w === 'p')) return byName.get(`${w} tbl`);
  if (w === 'sl' && m === 'wyib') return byName.get('sl');
  if (w === 'sl' && m === 'wyif') return byName.get('sl wyif');
  return undefined;
}
