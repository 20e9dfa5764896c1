// Smaller parts of the diff on hand-made inputs: header colours, and how
// diagnostics are matched across an inserted round (round numbers follow the
// pairing; chart row numbers and line numbers do not count).
import { describe, expect, it } from 'vitest';
import type { Diagnostic, PatternHeader } from '../../../shared/index';
import { diffHeader, isHeaderChanged } from '../../../shared/diff/header';
import { diffDiagnostics } from '../../../shared/diff/diagnostics';
import type { RoundPairing } from '../../../shared/diff/size-diff';

const header = (over: Partial<PatternHeader> = {}): PatternHeader => ({
  title: 'Lantern Mitts', designer: 'Maren Tolley', item: 'hand', sizes: ['S', 'M', 'L'], construction: 'round',
  gauge: { stitches: 32, rows: 36, per: '10cm' }, yarns: [{ name: 'A', label: 'Lantern Gold', colour: '#d9a441' }, { name: 'B', label: 'Dusk', colour: '#2b2d42' }],
  floatLimit: { value: 1, unit: 'in' }, ...over,
});

describe('diffHeader', () => {
  it('finds no change in the same header, nor in a colour written in capitals (#D9A441 is #d9a441)', () => {
    expect(isHeaderChanged(diffHeader(header(), header()))).toBe(false);
    const caps = header({ yarns: [{ name: 'A', label: 'Lantern Gold', colour: '#D9A441' }, { name: 'B', label: 'Dusk', colour: '#2b2d42' }] });
    expect(isHeaderChanged(diffHeader(header(), caps))).toBe(false);
  });
  it('reports a reordering of the sizes, and yarns added and removed by name', () => {
    const d = diffHeader(header(), header({ sizes: ['S', 'L', 'M'], yarns: [{ name: 'A', label: 'Lantern Gold', colour: '#d9a441' }, { name: 'C', label: 'Tide', colour: '#3c6e71' }] }));
    expect(d.sizes.order).toEqual({ old: ['S', 'M', 'L'], new: ['S', 'L', 'M'] });
    expect(d.yarns.added.map((y) => y.name)).toEqual(['C']);
    expect(d.yarns.removed.map((y) => y.name)).toEqual(['B']);
  });
});

const span = (line: number) => ({ from: line * 10, to: line * 10 + 5, line, column: 1, endLine: line, endColumn: 6 });
const diag = (message: string, line: number, size = 'M'): Diagnostic => ({ code: 'LW304', severity: 'error', span: span(line), size, message });

describe('diffDiagnostics', () => {
  // Old rounds 1-5, new rounds 1-6 with a round inserted at 3: old 1-2 = new 1-2, old 3-5 = new 4-6.
  const pairing: RoundPairing = {
    steps: [],
    oldToken: new Map([[1, 'm1:1'], [2, 'm2:2'], [3, 'm3:4'], [4, 'm4:5'], [5, 'm5:6']]),
    newToken: new Map([[1, 'm1:1'], [2, 'm2:2'], [3, 'n3'], [4, 'm3:4'], [5, 'm4:5'], [6, 'm5:6']]),
  };
  const tokens = { bySize: new Map([['M', pairing]]), common: { old: pairing.oldToken, new: pairing.newToken } };

  it('keeps a finding that moved down a round and a line as unchanged; the chart row number is not a round', () => {
    const before = [diag('chart wave row 3 is 8 stitches wide but only 6 are left in round 5 (size M)', 20)];
    const after = [diag('chart wave row 3 is 8 stitches wide but only 6 are left in round 6 (size M)', 21)];
    expect(diffDiagnostics(before, after, tokens)).toEqual({ introduced: [], fixed: [], unchanged: 1 });
  });

  it('tells a finding on the inserted round from one on the round it displaced', () => {
    const before = [diag('round 3 works 10 stitches but 12 are on the needle (size M)', 12)];
    const after = [diag('round 3 works 10 stitches but 12 are on the needle (size M)', 12)];
    const d = diffDiagnostics(before, after, tokens);
    expect([d.introduced.length, d.fixed.length, d.unchanged]).toEqual([1, 1, 0]);
  });

  it('counts findings as a multiset and keeps the size apart', () => {
    const twice = [diag('round 1 works 10 stitches but 12 are on the needle (size M)', 5), diag('round 1 works 10 stitches but 12 are on the needle (size M)', 7)];
    const d = diffDiagnostics(twice, [twice[0], { ...twice[0], size: 'S' }], tokens);
    expect(d.unchanged).toBe(1);
    expect(d.fixed.map((x) => x.line)).toEqual([7]);
    expect(d.introduced.map((x) => x.size)).toEqual(['S']);
  });
});
