/**
 * What every part of the checker shares while building one size: the
 * resolved header, the size, graded-number resolution and a diagnostics sink
 * that suppresses repeats (one report per place and code per size).
 */
import type { Diagnostic, Span } from '../types';
import type { Graded, NameRef } from '../notation';
import { makeDiagnostic, closestName, type Facts } from '../diagnostics';
import type { ResolvedHeader } from './header';

/** False in the studio's client build, which compiles trace recording out (build-flags.d.ts). */
export const TRACED = typeof __LW_NO_TRACE__ === 'undefined';

/** Fixed bounds that keep any input finite. */
export const LIMITS = {
  /** Stitches worked per size, over all rounds. */
  stitchesPerSize: 2_000_000,
  /** Highest round number. */
  rounds: 100_000,
  /** Repeat passes that work no stitch, per size (guards repeats of zero-stitch operations). */
  steps: 2_000_000,
  /**
   * Operations carried out per size (each operation of a line once per pass
   * of its repeat). The other bounds leave the operations of one pass free:
   * a repeat of many operations that together work one stitch a pass would
   * otherwise run for minutes below the stitch bound. Real patterns carry out
   * far fewer than one per stitch (rounds repeated unchanged are not worked again).
   */
  operations: 5_000_000,
  /** Diagnostics per code per size before LW902. */
  perCode: 50,
} as const;

/** One call of Reporter.report, as made. */
export interface ReportCall { code: string; span: Span; facts: Facts; size: string | undefined; key: string; related: { span: Span; message: string }[] | undefined }

/** Per-compile sink: dedupes by code+place (+size), caps per code. */
export class Reporter {
  readonly list: Diagnostic[] = [];
  private seen = new Set<string>();
  /**
   * Per span object, the (code, size, key) triples already seen, flat: a
   * repeat from the same place (an operation reporting on every pass of a
   * long repeat) is recognised without building the string id.
   */
  private seenAt = new WeakMap<Span, (string | undefined)[]>();
  private counts = new Map<string, number>();
  private dropped = new Map<string, { count: number; span: Span }>();

  /** Calls of `report`, suppressed ones included. */
  calls = 0;
  /** When set, every call of `report` is appended here as made (the incremental compiler replays them). */
  trace: ReportCall[] | null = null;
  /**
   * When set (the incremental compiler), the diagnostic made for a facts
   * object: a later call with the same facts object, code, place and size
   * (callers that keep their facts across compiles) reuses it.
   */
  made: WeakMap<object, Diagnostic> | null = null;

  /** Reports once per (code, place, size, key); returns false when suppressed. */
  report(code: string, span: Span, facts: Facts, size?: string, key = '', related?: { span: Span; message: string }[]): boolean {
    this.calls++;
    if (TRACED) this.trace?.push({ code, span, facts, size, key, related });
    if (this.madeAt(code, span, size, key)) return false;
    let known = this.seenAt.get(span);
    if (!known) this.seenAt.set(span, (known = []));
    // A few triples per place; past that (many keys at one place) only the string id is kept.
    if (known.length < 3 * 16) known.push(code, size, key);
    const id = `${code}@${span.from}-${span.to}/${size ?? ''}/${key}`;
    if (this.seen.has(id)) return false;
    this.seen.add(id);
    const n = (this.counts.get(code) ?? 0) + 1;
    this.counts.set(code, n);
    if (n > LIMITS.perCode) {
      const d = this.dropped.get(code);
      if (d) d.count++; else this.dropped.set(code, { count: 1, span });
      return false;
    }
    if (TRACED && this.made && !related) {
      let d = this.made.get(facts);
      if (!d || d.code !== code || d.span !== span || d.size !== size) this.made.set(facts, (d = makeDiagnostic(code, span, { ...facts, ...(size !== undefined ? { size } : {}) }, { size })));
      this.list.push(d);
      return true;
    }
    this.list.push(makeDiagnostic(code, span, { ...facts, ...(size !== undefined ? { size } : {}) }, { size, related }));
    return true;
  }

  /**
   * True when `report(code, span, …, size, key)` would be a repeat of a call
   * already made from the same place; the call is counted as made. Hot
   * callers ask first so a repeat costs no facts object. Always false while
   * tracing (the trace keeps every call with its facts).
   */
  repeat(code: string, span: Span, size: string | undefined, key: string): boolean {
    if ((TRACED && this.trace) || !this.madeAt(code, span, size, key)) return false;
    this.calls++;
    return true;
  }

  /** True when this (code, size, key) was reported from this span object before (seenAt). */
  private madeAt(code: string, span: Span, size: string | undefined, key: string): boolean {
    const known = this.seenAt.get(span);
    if (known) for (let i = 0; i < known.length; i += 3) if (known[i] === code && known[i + 1] === size && known[i + 2] === key) return true;
    return false;
  }

  /** Appends LW902 notes for capped codes and returns everything. */
  finish(): Diagnostic[] {
    for (const [code, d] of this.dropped) this.list.push(makeDiagnostic('LW902', d.span, { count: d.count, code }));
    return this.list;
  }
}

/** The state shared while building one size. */
export class SizeContext {
  constructor(
    readonly head: ResolvedHeader,
    readonly size: string,
    readonly sizeIndex: number,
    readonly reporter: Reporter,
  ) {}

  /** The size name to put on diagnostics (absent for the single implicit size). */
  get sizeLabel(): string | undefined {
    return this.head.header.sizes.length ? this.size : undefined;
  }

  /** Resolves a graded number for this size (LW201 when the list length is wrong). */
  graded(g: Graded): number {
    const n = this.head.sizes.length;
    if (g.values.length === 1) return g.values[0];
    if (g.values.length !== n) {
      this.reporter.report('LW201', g.span, { count: g.values.length, sizes: n, sizeNames: this.head.sizes.join(' ') });
      return g.values[Math.min(this.sizeIndex, g.values.length - 1)];
    }
    return g.values[this.sizeIndex];
  }

  /** Resolves a yarn name to its index (LW202 and the default yarn when unknown). */
  yarn(ref: NameRef | null, fallback: number): number {
    if (!ref) return fallback;
    const i = this.head.yarnIndex.get(ref.name);
    if (i !== undefined) return i;
    // Asked first: the suggestion is a search over every yarn name, and a repeat pass asks again and again.
    if (!this.reporter.repeat('LW202', ref.span, undefined, '')) {
      this.reporter.report('LW202', ref.span, { name: ref.name, suggest: closestName(ref.name, this.head.yarnIndex.keys()) ?? '' });
    }
    return fallback;
  }

  /** See Reporter.repeat: true (counted) when this size-specific report would repeat one already made. */
  repeat(code: string, span: Span, key = ''): boolean {
    return this.reporter.repeat(code, span, this.sizeLabel, key);
  }

  /** Reports a size-specific finding. */
  report(code: string, span: Span, facts: Facts, key = '', related?: { span: Span; message: string }[]): boolean {
    return this.reporter.report(code, span, facts, this.sizeLabel, key, related);
  }
}
