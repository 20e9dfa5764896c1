/**
 * The source table: spans referenced by stitches. Each stitch stores an index
 * into this table (Uint32), so the model stays compact and a click on a chart
 * cell can find its line.
 */
import type { Span } from '../types';
import type { Op, PatternAst, RoundLine } from '../notation';

/**
 * Append-only list of spans with identity lookup for AST nodes. The nodes a
 * round can name (ladder lines, round lines and every operation in them) are
 * numbered up front (`preassign`), in AST order, so a stitch's source index
 * depends on the AST alone and not on which rounds were worked first: the
 * incremental compiler (shared/incremental.ts) relies on that to reuse
 * stitches from an earlier compile.
 */
export class SourceTable {
  readonly spans: Span[] = [];
  /** The node behind each index (null for spans added without one). */
  readonly nodes: (object | null)[] = [];
  private byNode = new Map<object, number>();

  /** Adds a span and returns its index. */
  add(span: Span, node: object | null = null): number {
    this.spans.push(span);
    this.nodes.push(node);
    return this.spans.length - 1;
  }

  /**
   * Numbers the ladder lines, the round lines, then the operations of each
   * round line (depth first). Lines come before operations so that an edit
   * that adds or removes an operation leaves every line's number as it was
   * (the rounds' `lines` keep their numbers; see shared/incremental.ts).
   */
  preassign(ast: PatternAst): void {
    this.assigned = this.spans.length;
    for (const l of ast.ladders) this.of(l);
    for (const line of ast.rounds) this.of(line);
    const ops = (list: readonly Op[]): void => {
      for (const op of list) {
        this.of(op);
        if (op.type === 'group') ops(op.ops);
      }
    };
    for (const line of ast.rounds) ops(line.ops);
    this.assignedEnd = this.spans.length;
  }

  /** Where preassign's numbers begin and end (-1: not numbered by preassign or carryOver). */
  private assigned = -1;
  private assignedEnd = -1;

  /**
   * For the incremental compiler: numbers this table (which holds what was
   * added before preassign) exactly as `preassign(ast)` would, taking over
   * `old`'s numbers, when `ast` differs from the AST `old` numbered only by
   * `replaced` round lines (old line -> new line at the same place; every
   * other ladder, line and operation the same object). Takes over `old`'s
   * lookup (`old` must not be used afterwards). Returns new index by old
   * index (-1: gone), or null when it cannot (then call preassign).
   */
  carryOver(old: SourceTable, replaced: ReadonlyMap<RoundLine, RoundLine>): Int32Array | null {
    const start = this.spans.length;
    if (old.assigned !== start || old.assignedEnd !== old.spans.length || this.assigned !== -1 || this.byNode.size !== 0) return null;
    const opsOf = (line: RoundLine): object[] => {
      const out: object[] = [];
      const walk = (list: readonly Op[]): void => {
        for (const op of list) { out.push(op); if (op.type === 'group') walk(op.ops); }
      };
      walk(line.ops);
      return out;
    };
    // Each replaced line's operations: where they were, and the new ones.
    const cuts: { line: number; from: number; to: number; old: object[]; now: object[]; was: RoundLine; is: RoundLine }[] = [];
    for (const [was, is] of replaced) {
      const line = old.byNode.get(was);
      const before = opsOf(was), now = opsOf(is);
      // A line without operations has no place of its own among them: number afresh.
      if (line === undefined || before.length === 0 || now.length === 0) return null;
      const from = old.byNode.get(before[0]);
      if (from === undefined) return null;
      for (let j = 0; j < before.length; j++) if (old.nodes[from + j] !== before[j]) return null;
      cuts.push({ line, from, to: from + before.length, old: before, now, was, is });
    }
    cuts.sort((a, b) => a.from - b.from);
    const map = new Int32Array(old.spans.length);
    for (let i = 0; i < start; i++) map[i] = old.nodes[i] === null && this.nodes[i] === null ? i : -1;
    const byNode = old.byNode;
    let at = start, shift = 0;
    const copy = (from: number, to: number): void => {
      for (let i = from; i < to; i++) {
        this.spans.push(old.spans[i]);
        this.nodes.push(old.nodes[i]);
        map[i] = i + shift;
        if (shift !== 0) byNode.set(old.nodes[i]!, i + shift);
      }
      at = to;
    };
    for (const c of cuts) {
      copy(at, c.from);
      for (let i = c.from; i < c.to; i++) { byNode.delete(c.old[i - c.from]); map[i] = -1; }
      for (const n of c.now) {
        byNode.set(n, this.spans.length);
        this.spans.push((n as { span: Span }).span);
        this.nodes.push(n);
      }
      at = c.to;
      shift += c.now.length - c.old.length;
    }
    copy(at, old.spans.length);
    // The replaced lines themselves keep their numbers (lines come before operations).
    for (const c of cuts) {
      byNode.delete(c.was);
      byNode.set(c.is, c.line);
      this.spans[c.line] = c.is.span;
      this.nodes[c.line] = c.is;
      map[c.line] = -1;
    }
    this.byNode = byNode;
    this.assigned = start;
    this.assignedEnd = this.spans.length;
    return map;
  }

  /** The index of a node numbered before, or undefined. */
  indexOf(node: object): number | undefined {
    return this.byNode.get(node);
  }

  /** The index for an AST node's span (added on first use). */
  of(node: { span: Span }): number {
    let i = this.byNode.get(node);
    if (i === undefined) {
      i = this.add(node.span, node);
      this.byNode.set(node, i);
    }
    return i;
  }
}
