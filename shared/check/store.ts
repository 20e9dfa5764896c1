/**
 * Compact stitch-level storage for one size: flat typed arrays, one entry per
 * stitch on the needle at the end of each round, rounds one after another.
 * No object per stitch; see README.md for the layout.
 */

/** Bit flags stored per stitch. */
export const FLAG = {
  /** A backing stitch (behind the fabric, takes no width). */
  BACKING: 1,
  /** Worked from a chart cell. */
  CHART: 2,
  /** A backing stitch of a ladder line: worked and closed automatically. */
  MANAGED: 4,
  /** Left on the needle unworked because the round's count did not add up. */
  UNWORKED: 8,
} as const;

/** Growable struct-of-arrays of stitches. Invariant: every array has the same capacity >= length. */
export class StitchStore {
  /** Operation code per stitch (index into STITCHES). */
  op: Uint8Array;
  /** Yarn index per stitch (index into SizeModel.stitchLevel.yarns). */
  yarn: Uint8Array;
  /** FLAG bits per stitch. */
  flags: Uint8Array;
  /** Source index per stitch (index into SizeModel.stitchLevel.sources). */
  src: Uint32Array;
  /** Backing column id per stitch (-1 for front stitches). */
  col: Int32Array;
  /** Stitches stored. */
  length = 0;

  constructor(capacity = 1024) {
    this.op = new Uint8Array(capacity);
    this.yarn = new Uint8Array(capacity);
    this.flags = new Uint8Array(capacity);
    this.src = new Uint32Array(capacity);
    this.col = new Int32Array(capacity);
  }

  /** Makes room for `extra` more stitches (amortised doubling). */
  reserve(extra: number): void {
    const need = this.length + extra;
    if (need <= this.op.length) return;
    let cap = this.op.length * 2;
    while (cap < need) cap *= 2;
    const grow = <A extends Uint8Array | Uint32Array | Int32Array>(a: A, make: (n: number) => A): A => {
      const b = make(cap);
      b.set(a.subarray(0, this.length));
      return b;
    };
    this.op = grow(this.op, (n) => new Uint8Array(n));
    this.yarn = grow(this.yarn, (n) => new Uint8Array(n));
    this.flags = grow(this.flags, (n) => new Uint8Array(n));
    this.src = grow(this.src, (n) => new Uint32Array(n));
    this.col = grow(this.col, (n) => new Int32Array(n));
  }

  /** Narrows the arrays to their length (views, no copy) for a finished model. */
  trim(): void {
    const n = this.length;
    this.op = this.op.subarray(0, n);
    this.yarn = this.yarn.subarray(0, n);
    this.flags = this.flags.subarray(0, n);
    this.src = this.src.subarray(0, n);
    this.col = this.col.subarray(0, n);
  }
}
