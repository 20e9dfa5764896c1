// Golden files of the semantic diff (cases.ts) and, per case, the facts a
// reviewer would check by hand. Counts are checked against the compiler's
// own JSON (toCheckJson, the `loop check --json` contract), and against the
// trade's arithmetic where stated (common practice: k2tog and ssk take two
// stitches and leave one; m1l and m1r add one).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compile, toCheckJson } from '../../../shared/index';
import { diffRevisions, formatDiffText, type RevisionDiff, type SizeDiff } from '../../../shared/diff';
import { CASES, goldenPath, readCase, type CaseName } from './cases';

const diffOf = (name: CaseName): RevisionDiff => { const s = readCase(name); return diffRevisions(s.old, s.new); };
const size = (d: RevisionDiff, name: string): SizeDiff => {
  const s = d.sizes.find((x) => x.size === name);
  if (!s) throw new Error(`no size ${name}`);
  return s;
};

describe('golden files (regenerate with tests/shared/diff/generate-golden.ts, review like code)', () => {
  it.each(CASES)('%s matches its golden JSON and text', (name) => {
    const d = diffOf(name);
    expect(d).toEqual(JSON.parse(readFileSync(goldenPath(name, 'json'), 'utf8')));
    expect(`${formatDiffText(d, { cells: 1000 })}\n`).toBe(readFileSync(goldenPath(name, 'txt'), 'utf8'));
  });
});

describe('a changed repeat', () => {
  const d = diffOf('changed-repeat');
  it('changes round 13 in stitches and counts and only the counts of the rounds after it', () => {
    for (const s of d.sizes) {
      expect(s.rounds.map((r) => [r.kind, r.new?.number, r.aspects])).toEqual([
        ['changed', 13, ['counts', 'stitches']],
        ['changed', 14, ['counts', 'stitches']],
        ['changed', 15, ['counts', 'stitches']],
        ['changed', 16, ['counts', 'stitches']],
      ]);
      expect(s.unchanged).toBe(12);
    }
  });
  it('gives the old and new counts of the decrease round (112 sts: 16 repeats of 7 leave 96, 8 repeats of 14 leave 104)', () => {
    const r13 = size(d, 'S').rounds[0];
    expect([r13.old!.front, r13.new!.front]).toEqual([112 - 112 / 7, 112 - 112 / 14]);
  });
  it('agrees with the compiler JSON on every changed round', () => {
    const src = readCase('changed-repeat');
    const o = toCheckJson(compile(src.old)), n = toCheckJson(compile(src.new));
    for (const s of d.sizes) {
      const or = o.sizes.find((x) => x.name === s.size)!.rounds, nr = n.sizes.find((x) => x.name === s.size)!.rounds;
      for (const r of s.rounds) {
        const a = or.find((x) => x.number === r.old!.number)!, b = nr.find((x) => x.number === r.new!.number)!;
        expect([r.old!.front, r.old!.backing, r.old!.total]).toEqual([a.front, a.backing, a.total]);
        expect([r.new!.front, r.new!.backing, r.new!.total]).toEqual([b.front, b.backing, b.total]);
      }
    }
  });
});

describe('an added gusset round', () => {
  const d = diffOf('added-gusset-round');
  it('adds exactly round 11 and pairs every later round with the round before it', () => {
    for (const s of d.sizes) {
      expect(s.rounds.filter((r) => r.kind !== 'changed').map((r) => [r.kind, r.new?.number])).toEqual([['added', 11]]);
      const later = s.rounds.filter((r) => r.kind === 'changed');
      expect(later.map((r) => [r.old!.number, r.new!.number])).toEqual([12, 13, 14, 15, 16, 17, 18, 19, 20, 21].map((n) => [n - 1, n]));
      expect(s.unchanged).toBe(10); // rounds 1-10 are untouched
    }
  });
  it('counts two more stitches on every round after the added increase (m1l + m1r), and changes only the gusset cells', () => {
    for (const s of d.sizes) {
      for (const r of s.rounds.filter((x) => x.kind === 'changed')) {
        expect(r.new!.front - r.old!.front).toBe(2);
        expect(r.cellsChanged).toBeLessThanOrEqual(3);
      }
    }
  });
});

describe('a recoloured chart cell', () => {
  const d = diffOf('recoloured-cell');
  it('changes only the rounds that work chart row 2 (rounds 5-10 work rows 1, 2, 3, 1, 2, 3)', () => {
    for (const s of d.sizes) expect(s.rounds.map((r) => r.new!.number)).toEqual([6, 9]);
  });
  it('lists one cell per 8-stitch repeat, B to A, at the recoloured column read right to left', () => {
    for (const s of d.sizes) {
      const castOn = d.new.sizes.find((x) => x.name === s.size)!.castOn;
      expect(s.cellsTotal).toBe(2 * (castOn / 8));
      for (const c of s.cells) {
        expect([c.old!.op, c.old!.yarn, c.new!.op, c.new!.yarn]).toEqual(['k', 'B', 'k', 'A']);
        expect((c.new!.stitch - 2) % 8).toBe(0); // 7th cell from the left of an 8-wide row is the 2nd from the right
      }
      expect(s.rounds.every((r) => !r.aspects.includes('counts'))).toBe(true);
    }
  });
});

describe('a moved backing column', () => {
  const d = diffOf('moved-column');
  it('reports one moved column, after stitch 12 -> after stitch 15, same rows', () => {
    expect(size(d, 'one').columns).toEqual([
      { kind: 'moved', old: { yarn: 'B', after: 12, firstRound: 3, lastRound: 11 }, new: { yarn: 'B', after: 15, firstRound: 3, lastRound: 11 } },
    ]);
  });
  it('changes no front counts and no front cell before the closing row (backing stitches take no width)', () => {
    const s = size(d, 'one');
    expect(s.rounds.every((r) => !r.aspects.includes('counts'))).toBe(true);
    expect(s.rounds.filter((r) => r.aspects.includes('stitches')).map((r) => r.new!.number)).toEqual([12]);
    expect(s.word).toBe('row');
  });
  it('shows the closing row 12 (WS) as the chart does: knit on the WS shows as purl on the RS (garter; common practice)', () => {
    const s = size(d, 'one');
    expect(s.cells.map((c) => [c.round.new, c.old!.op, c.new!.op])).toEqual([[12, 'close k2tog', 'p'], [12, 'p', 'close k2tog']]);
  });
});

describe('a header change', () => {
  const d = diffOf('header-change');
  it('reports gauge, float limit, the added size and the recoloured and relabelled yarn, and no round', () => {
    expect(d.header.gauge).toEqual({ old: { stitches: 28, rows: 32, per: '10cm' }, new: { stitches: 26, rows: 30, per: '10cm' } });
    expect(d.header.floatLimit).toEqual({ old: { value: 1, unit: 'in' }, new: { value: 2.5, unit: 'cm' } });
    expect(d.header.sizes).toEqual({ added: ['XL'], removed: [], order: null });
    expect(d.header.yarns.recoloured).toEqual([{ name: 'B', old: '#e6f2ee', new: '#5a7d4f' }]);
    expect(d.header.yarns.relabelled).toEqual([{ name: 'B', old: 'Sea Foam', new: 'Kelp' }]);
    expect(d.header.title).toBeNull();
    expect(d.sizes.map((s) => s.size)).toEqual(['S', 'M', 'L']);
    expect(d.summary.roundsChanged + d.summary.roundsAdded + d.summary.roundsRemoved).toBe(0);
  });
});

describe('diagnostics introduced and fixed', () => {
  const d = diffOf('diagnostics');
  it('fixes the repeat of round 9 in every size and introduces the unknown yarn', () => {
    expect(d.diagnostics.introduced.map((x) => [x.code, x.size, x.line])).toEqual([['LW202', null, 15]]);
    const fixed302 = d.diagnostics.fixed.filter((x) => x.code === 'LW302');
    expect(fixed302.map((x) => x.size)).toEqual(['S', 'M', 'L']);
    expect(fixed302.every((x) => x.message.startsWith('round 9:'))).toBe(true);
  });
  it('keeps the float warning of rounds 7-8, now rounds 8-9 one line further down, as unchanged', () => {
    const src = readCase('diagnostics');
    const was = compile(src.old).diagnostics.filter((x) => x.code === 'LW501' && x.message.startsWith('rounds 7-8'));
    const now = compile(src.new).diagnostics.filter((x) => x.code === 'LW501' && x.message.startsWith('rounds 8-9'));
    expect(was.length).toBe(3);
    expect(now.length).toBe(3);
    expect(now[0].span.line).toBe(was[0].span.line + 1);
    const listed = [...d.diagnostics.introduced, ...d.diagnostics.fixed].filter((x) => /^rounds [78]-[89]/.test(x.message));
    expect(listed).toEqual([]);
    expect(d.diagnostics.unchanged).toBe(3);
  });
});
