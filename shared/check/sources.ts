/**
 * The source table: spans referenced by stitches. Each stitch stores an index
 * into this table (Uint32), so the model stays compact and a click on a chart
 * cell can find its line.
 */
import type { Span } from '../types';
import type { Op, PatternAst } from '../notation';

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
  /** Node -> index (shared/check/carry-sources.ts takes it over after an edit). */
  byNode = new Map<object, number>();

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
    for (const l of ast.ladders) this.of(l);
    for (const line of ast.rounds) this.of(line);
    const ops = (list: readonly Op[]): void => {
      for (const op of list) {
        this.of(op);
        if (op.type === 'group') ops(op.ops);
      }
    };
    for (const line of ast.rounds) ops(line.ops);
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
