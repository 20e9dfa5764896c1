/**
 * The source table (shared/check/sources.ts): `carrySources`
 * (shared/check/carry-sources.ts), which the
 * incremental compiler uses to renumber after an edit, must give exactly the
 * numbers `preassign` gives the new AST (a stitch's source index is part of
 * the model), and say where each old number went.
 */
import { describe, expect, it } from 'vitest';
import { SourceTable } from '../../shared/check/sources.ts';
import { carrySources } from '../../shared/check/carry-sources.ts';
import type { RoundLine } from '../../shared/notation/ast.ts';
import { parseSource } from '../../shared/notation/index.ts';
import { editPatternSource } from '../bench/edit-pattern.ts';

const origin = { from: 0, to: 0, line: 1, column: 1, endLine: 1, endColumn: 1 };

/** A table as check() builds it: the cast-on, two chart rows, then the numbered AST. */
function table(): SourceTable {
  const t = new SourceTable();
  t.add(origin);
  t.add(origin);
  t.add(origin);
  return t;
}

describe('carrySources', () => {
  const base = parseSource(editPatternSource()).ast;
  const line = base.rounds.findIndex((l) => l.segment?.name === 'front' && l.first.values[0] === 150);

  for (const [what, text] of [
    ['one operation more', 'round 150 at front in A: (k 1, p 1, catch B) to end'],
    ['one operation fewer', 'round 150 at front in A: k to end'],
    ['as many operations', 'round 150 at front in A: (p 2, catch B) to end'],
  ] as const) {
    it(`numbers an AST with one round line replaced (${what}) as preassign does, and maps the old numbers`, () => {
      const old = table();
      old.preassign(base);
      const oldNodes = [...old.nodes];
      const replacement = parseSource(`${text}\n`).ast.rounds[0];
      const is: RoundLine = { ...replacement, index: line };
      const ast = { ...base, rounds: base.rounds.map((l, i) => (i === line ? is : l)) };

      const fresh = table();
      fresh.preassign(ast);
      const carried = table();
      const map = carrySources(carried, old, { start: 3, end: old.spans.length }, new Map([[base.rounds[line], is]]));
      expect(map).not.toBeNull();
      expect(carried.nodes).toEqual(fresh.nodes);
      expect(carried.nodes.every((n, i) => n === fresh.nodes[i])).toBe(true);
      expect(carried.spans.every((s, i) => s === fresh.spans[i])).toBe(true);
      for (let i = 0; i < fresh.nodes.length; i++) if (fresh.nodes[i]) expect(carried.indexOf(fresh.nodes[i]!)).toBe(i);
      // Every old number goes to the same node's new number, or -1 when the node is gone.
      oldNodes.forEach((n, i) => {
        const j = map![i];
        if (j < 0) expect(n === base.rounds[line] || (n !== null && !fresh.nodes.includes(n))).toBe(true);
        else expect(fresh.nodes[j]).toBe(n);
      });
      expect(carried.indexOf(base.rounds[line])).toBeUndefined();
    });
  }

  it('declines when the table was not numbered from the same start or to its end, or a line has no operations', () => {
    const old = table();
    old.preassign(base);
    const other = new SourceTable();
    other.add(origin);
    const is: RoundLine = { ...base.rounds[line], ops: [] };
    expect(carrySources(other, old, { start: 3, end: old.spans.length }, new Map([[base.rounds[line], { ...base.rounds[line] }]]))).toBeNull();
    expect(carrySources(table(), old, { start: 3, end: old.spans.length + 1 }, new Map([[base.rounds[line], { ...base.rounds[line] }]]))).toBeNull();
    expect(carrySources(table(), old, { start: 3, end: old.spans.length }, new Map([[base.rounds[line], is]]))).toBeNull();
  });
});
