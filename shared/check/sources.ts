/**
 * The source table: spans referenced by stitches. Each stitch stores an index
 * into this table (Uint32), so the model stays compact and a click on a chart
 * cell can find its line.
 */
import type { Span } from '../types';

/** Append-only list of spans with identity lookup for AST nodes. */
export class SourceTable {
  readonly spans: Span[] = [];
  private byNode = new Map<object, number>();

  /** Adds a span and returns its index. */
  add(span: Span): number {
    this.spans.push(span);
    return this.spans.length - 1;
  }

  /** The index for an AST node's span (added on first use). */
  of(node: { span: Span }): number {
    let i = this.byNode.get(node);
    if (i === undefined) {
      i = this.add(node.span);
      this.byNode.set(node, i);
    }
    return i;
  }
}
