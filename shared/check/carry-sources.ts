/**
 * Renumbering the source table after an edit, for the incremental compiler
 * (shared/incremental.ts; not part of the studio's compile worker).
 */
import type { Span } from '../types';
import type { Op, RoundLine } from '../notation';
import type { SourceTable } from './sources';

/**
 * Numbers `table` (which holds what check() added before preassign) exactly
 * as `table.preassign(ast)` would, taking over `old`'s numbers, when `ast`
 * differs from the AST `old` numbered only by `replaced` round lines (old
 * line -> new line at the same place; every other ladder, line and
 * operation the same object). `oldNumbered`: where preassign (or this)
 * numbered `old` from and to. Takes over `old`'s lookup (`old` must not be
 * used afterwards). Returns new index by old index (-1: gone), or null when
 * it cannot (then call preassign).
 */
export function carrySources(table: SourceTable, old: SourceTable, oldNumbered: { start: number; end: number }, replaced: ReadonlyMap<RoundLine, RoundLine>): Int32Array | null {
  const start = table.spans.length;
  if (oldNumbered.start !== start || oldNumbered.end !== old.spans.length || table.byNode.size !== 0) return null;
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
  for (let i = 0; i < start; i++) map[i] = old.nodes[i] === null && table.nodes[i] === null ? i : -1;
  const byNode = old.byNode;
  let at = start, shift = 0;
  const copy = (from: number, to: number): void => {
    for (let i = from; i < to; i++) {
      table.spans.push(old.spans[i]);
      table.nodes.push(old.nodes[i]);
      map[i] = i + shift;
      if (shift !== 0) byNode.set(old.nodes[i]!, i + shift);
    }
    at = to;
  };
  for (const c of cuts) {
    copy(at, c.from);
    for (let i = c.from; i < c.to; i++) { byNode.delete(c.old[i - c.from]); map[i] = -1; }
    for (const n of c.now) {
      byNode.set(n, table.spans.length);
      table.spans.push((n as { span: Span }).span);
      table.nodes.push(n);
    }
    at = c.to;
    shift += c.now.length - c.old.length;
  }
  copy(at, old.spans.length);
  // The replaced lines themselves keep their numbers (lines come before operations).
  for (const c of cuts) {
    byNode.delete(c.was);
    byNode.set(c.is, c.line);
    table.spans[c.line] = c.is.span;
    table.nodes[c.line] = c.is;
    map[c.line] = -1;
  }
  table.byNode = byNode;
  return map;
}
