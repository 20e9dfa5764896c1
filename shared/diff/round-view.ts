/**
 * Reading one size's stitch-level model for the diff: per-round keys for
 * alignment, the front stitches (chart cells) and backing stitches of a
 * round in right-side order, and the round as the diff shows it.
 *
 * Everything compared across revisions is by content (yarn names, stitch
 * table codes, note text), never by revision-local indexes, so that keys
 * are equal for equal rounds and the alignment tie-break is symmetric.
 */
import type { SizeModel } from '../index';
import type { RoundState } from './types';

const FLAG_BACKING = 1; // shared/check/store.ts FLAG.BACKING

/** 32-bit FNV-1a of a string (content hash for keys; never used alone for equality of details). */
export function hashString(s: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x01000193);
  return h >>> 0;
}

/** Two independent 32-bit running hashes (64 bits of key: collisions are negligible and only cost a missed anchor). */
class Hasher {
  a = 0x811c9dc5;
  b = 0x9747b28c;
  add(v: number): void {
    this.a = Math.imul(this.a ^ (v & 0xffff), 0x01000193);
    this.a = Math.imul(this.a ^ (v >>> 16), 0x01000193);
    this.b = Math.imul(this.b ^ v, 0x5bd1e995);
    this.b ^= this.b >>> 15;
  }
  key(): string { return `${(this.a >>> 0).toString(36)}.${(this.b >>> 0).toString(36)}`; }
}

/**
 * What a stitch worked on a WS row shows on the right side (knit and purl
 * swapped), as charts draw it: the same pairs shared/check/charts.ts uses
 * to turn chart cells into WS stitches.
 */
const WS_SHOWS: Readonly<Record<string, string>> = { k: 'p', p: 'k', 'k tbl': 'p tbl', 'p tbl': 'k tbl', k2tog: 'p2tog', p2tog: 'k2tog', ssk: 'ssp', ssp: 'ssk' };

/** Front stitches of a round as numbers (see {@link SizeView.fronts}). */
export interface Fronts { op: Int32Array; yarn: Int32Array; view: SizeView }

/** One size of one revision, prepared for diffing. */
export class SizeView {
  readonly flat: boolean;
  readonly word: 'round' | 'row';
  /** Content hash of each yarn name, by the model's yarn index. */
  private readonly yarnHash: Uint32Array;

  constructor(readonly model: SizeModel, flat: boolean) {
    this.flat = flat;
    this.word = flat ? 'row' : 'round';
    this.yarnHash = Uint32Array.from(model.stitches.yarns.map(hashString));
  }

  get roundCount(): number { return this.model.stitches.rounds.length; }

  /** Store index of the k-th stitch of round r in right-side order (WS rows are worked left to right as the chart shows them). */
  at(r: number, k: number): number {
    const rec = this.model.stitches.rounds[r];
    return rec.side === 'WS' ? rec.offset + rec.count - 1 - k : rec.offset + k;
  }

  /**
   * Keys of every round. `exact`: equal exactly when the rounds are the same
   * (every stitch's op, yarn and layer, counts, side, note, floats and
   * markers). `shape`: the sequence of distinct consecutive (op, yarn,
   * layer) runs and the side, without run lengths, so that "k to end" over
   * 60 or 61 stitches is the same shape.
   */
  keys(): { exact: string[]; shape: string[] } {
    const { store, rounds, yarns } = this.model.stitches;
    const exact: string[] = [], shape: string[] = [];
    const slices = new Map<string, { ex: Hasher; sh: string }>();
    for (let r = 0; r < rounds.length; r++) {
      const rec = rounds[r];
      const slice = `${rec.offset}:${rec.count}:${rec.side}`;
      let hashed = slices.get(slice);
      if (!hashed) {
        // Rounds may share one stored slice (shared/check/reuse.ts): hash its stitches once.
        const ex = new Hasher(), sh = new Hasher();
        const side = rec.side === 'WS' ? 1 : 0;
        ex.add(side); sh.add(side); ex.add(rec.count);
        let prev = -1;
        for (let k = 0; k < rec.count; k++) {
          const i = this.at(r, k);
          const tok = (store.op[i] | ((store.flags[i] & FLAG_BACKING) << 8)) >>> 0;
          const y = this.yarnHash[store.yarn[i]];
          ex.add(tok); ex.add(y);
          const run = (tok * 31 + y) >>> 0;
          if (run !== prev) { sh.add(tok); sh.add(y); prev = run; }
        }
        hashed = { ex, sh: sh.key() };
        slices.set(slice, hashed);
      }
      const ex = new Hasher();
      ex.a = hashed.ex.a; ex.b = hashed.ex.b;
      const sh = { key: () => hashed.sh };
      ex.add(rec.note === null ? 0 : hashString(`n${rec.note}`));
      for (const f of [...rec.floats].sort((x, z) => x.yarn - z.yarn)) { ex.add(hashString(yarns[f.yarn] ?? '')); ex.add(f.stitches); }
      for (const m of rec.markers) { ex.add(hashString(m.name)); ex.add(m.at); }
      exact.push(`${ex.key()}:${rec.count}`);
      shape.push(sh.key());
    }
    return { exact, shape };
  }

  /**
   * The front stitches of round r in right-side order, as numbers: the
   * stitch-table code of the stitch as it shows on the right side (on WS rows
   * knit and purl swapped, as a chart shows it) and the yarn's id in `yarnIds` (a table both views of
   * a diff share), so comparing two rounds compares numbers, not names.
   */
  fronts(r: number, yarnIds: ReadonlyMap<string, number>): Fronts {
    const { store, rounds, yarns } = this.model.stitches;
    const rec = rounds[r];
    const ids = yarns.map((y) => yarnIds.get(y) ?? -1);
    const op = new Int32Array(rec.front), yarn = new Int32Array(rec.front);
    const shown = rec.side === 'WS' ? this.rightSide() : null;
    let n = 0;
    for (let k = 0; k < rec.count && n < rec.front; k++) {
      const i = this.at(r, k);
      if (store.flags[i] & FLAG_BACKING) continue;
      op[n] = shown ? shown[store.op[i]] : store.op[i]; yarn[n] = ids[store.yarn[i]] ?? -1; n++;
    }
    return { op: op.subarray(0, n), yarn: yarn.subarray(0, n), view: this };
  }

  /**
   * True when round r of this view and round s of `other` are identical in
   * everything the diff compares (stitches with op, yarn and layer in
   * order, side, note, floats, markers). Allocation-free on the stitches:
   * the fast path for the many rounds an edit does not touch.
   */
  sameRound(r: number, other: SizeView, s: number, yarnIds: ReadonlyMap<string, number>): boolean {
    const x = this.model.stitches, y = other.model.stitches;
    const rx = x.rounds[r], ry = y.rounds[s];
    if (rx.count !== ry.count || rx.side !== ry.side || rx.note !== ry.note) return false;
    if (rx.floats.length !== ry.floats.length || rx.markers.length !== ry.markers.length) return false;
    if (rx.markers.some((m, k) => m.name !== ry.markers[k].name || m.at !== ry.markers[k].at)) return false;
    const fx = this.floats(r), fy = other.floats(s);
    if (fx.some((f, k) => f !== fy[k])) return false;
    const ix = x.yarns.map((n) => yarnIds.get(n) ?? -1), iy = y.yarns.map((n) => yarnIds.get(n) ?? -1);
    for (let k = 0; k < rx.count; k++) {
      const i = this.at(r, k), j = other.at(s, k);
      if (x.store.op[i] !== y.store.op[j] || ix[x.store.yarn[i]] !== iy[y.store.yarn[j]]) return false;
      if ((x.store.flags[i] & FLAG_BACKING) !== (y.store.flags[j] & FLAG_BACKING)) return false;
    }
    return true;
  }

  private rsCodes: Int32Array | null = null;

  /** Stitch-table code -> the code of the stitch as it shows on the right side when worked on a WS row. */
  private rightSide(): Int32Array {
    if (this.rsCodes) return this.rsCodes;
    const ops = this.model.stitches.ops;
    const byName = new Map(ops.map((o) => [o.name, o.code]));
    this.rsCodes = Int32Array.from(ops.map((o) => byName.get(WS_SHOWS[o.name] ?? o.name) ?? o.code));
    return this.rsCodes;
  }

  /** The name of a stitch-table code. */
  opName(code: number): string { return this.model.stitches.ops[code]?.name ?? `#${code}`; }

  /** The backing stitches of round r in right-side order, each as "front stitches before it|op|yarn". */
  backings(r: number): string[] {
    const { store, rounds, ops, yarns } = this.model.stitches;
    const out: string[] = [];
    let front = 0;
    for (let k = 0; k < rounds[r].count; k++) {
      const i = this.at(r, k);
      if (store.flags[i] & FLAG_BACKING) out.push(`${front}|${ops[store.op[i]]?.name ?? store.op[i]}|${yarns[store.yarn[i]] ?? ''}`);
      else front++;
    }
    return out;
  }

  /** Markers of round r as "name@front stitches before it" (working order). */
  markers(r: number): string[] {
    const { store, rounds } = this.model.stitches;
    const rec = rounds[r];
    const out: string[] = [];
    let front = 0, k = 0;
    for (const m of rec.markers) {
      for (; k < m.at && k < rec.count; k++) if (!(store.flags[rec.offset + k] & FLAG_BACKING)) front++;
      out.push(`${m.name}@${front}`);
    }
    return out;
  }

  /** Floats of round r as "yarn:stitches", sorted. */
  floats(r: number): string[] {
    const { rounds, yarns } = this.model.stitches;
    return rounds[r].floats.map((f) => `${yarns[f.yarn] ?? ''}:${f.stitches}`).sort();
  }

  /** The round as the diff shows it. */
  state(r: number): RoundState {
    const s = this.model.rounds[r];
    const rec = this.model.stitches.rounds[r];
    return {
      number: s.number, side: s.side, front: s.front, backing: s.backing, total: s.total,
      longestFloat: s.longestFloat ? { yarn: s.longestFloat.yarn, stitches: s.longestFloat.stitches } : null,
      note: rec.note, line: s.span.line, endLine: s.span.endLine,
    };
  }
}
