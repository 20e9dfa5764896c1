// Properties of the semantic diff over generated pairs of sources (fast-check):
// diff(a, a) is empty; diff(b, a) mirrors diff(a, b); the JSON round-trips;
// rounds are conserved (paired + added = new rounds, paired + removed = old
// rounds); rounds the diff does not mention agree with the compiler's own
// JSON (toCheckJson); the text hunks carry the sources' own lines and
// rebuild the new source from the old one.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compile, toCheckJson } from '../../../shared/index';
import { diffRevisions, type Change, type RevisionDiff, type TextDiff } from '../../../shared/diff';

// ---- a small generator of sources in the demo scenario (errors allowed: they must diff too) ----
const OPS = [
  'k to end', 'p to end', '(k2, p2) to end', '(k1 in A, k1 in B) to end', '(k3 in A, k1 in B) to end',
  'k1, m1l, k to last 1, m1r, k1', 'k2tog, k to last 2, ssk', 'k to end in B', 'chart band', '(k 5, k2tog) to end',
  'k 4, catch B, k to end',
];
interface Spec {
  twoSizes: boolean; flat: boolean; castOn: [number, number]; colourB: string; gauge: number | null;
  rounds: number[]; ladder: { from: number; span: number } | null; note: number | null;
}
const specArb: fc.Arbitrary<Spec> = fc.record({
  twoSizes: fc.boolean(),
  flat: fc.boolean(),
  castOn: fc.tuple(fc.constantFrom(24, 32, 40), fc.constantFrom(36, 48)),
  colourB: fc.constantFrom('#e6f2ee', '#5a7d4f'),
  gauge: fc.option(fc.constantFrom(24, 28), { nil: null }),
  rounds: fc.array(fc.nat(OPS.length - 1), { minLength: 1, maxLength: 14 }),
  ladder: fc.option(fc.record({ from: fc.integer({ min: 1, max: 8 }), span: fc.integer({ min: 1, max: 5 }) }), { nil: null }),
  note: fc.option(fc.nat(10), { nil: null }),
});
type Edit = { op: 'ins' | 'del' | 'set'; at: number; kind: number };
const editArb: fc.Arbitrary<Edit> = fc.record({ op: fc.constantFrom('ins', 'del', 'set'), at: fc.nat(20), kind: fc.nat(OPS.length - 1) });

function applyEdits(rounds: number[], edits: Edit[]): number[] {
  const out = [...rounds];
  for (const e of edits) {
    const at = e.at % (out.length + 1);
    if (e.op === 'ins') out.splice(at, 0, e.kind);
    else if (out.length > 1 && at < out.length) { if (e.op === 'del') out.splice(at, 1); else out[at] = e.kind; }
  }
  return out;
}

function source(s: Spec): string {
  const word = s.flat ? 'row' : 'round';
  const lines = [
    '# Saltmarsh Knits test swatch',
    'title "Tidepool Cowl"',
    'designer "Maren Tolley"',
    s.twoSizes ? 'sizes S M' : 'sizes M',
    ...(s.gauge ? [`gauge ${s.gauge} sts and 32 ${word}s per 10 cm`] : []),
    'yarn A "Harbour" #1d3557',
    `yarn B "Sea Foam" ${s.colourB}`,
    s.flat ? 'work flat' : 'work in the round',
    `cast on ${s.twoSizes ? `${s.castOn[0]}/${s.castOn[1]}` : s.castOn[1]} in A`,
    'chart band:',
    '  key "." A',
    '  key "x" B',
    '  |x...|',
    '  |.x..|',
  ];
  s.rounds.forEach((k, i) => lines.push(`${word} ${i + 1}: ${OPS[k]}${s.note === i ? ' note "check the count"' : ''}`));
  if (s.ladder) lines.push(`ladder B every 4 from ${word} ${s.ladder.from} to ${s.ladder.from + s.ladder.span}`);
  return `${lines.join('\n')}\n`;
}

const pairArb = fc.tuple(specArb, fc.array(editArb, { maxLength: 4 }), fc.option(specArb, { freq: 4, nil: null })).map(([a, edits, other]) => {
  // Mostly an edited copy of a (the usual revision), sometimes a different header too.
  const b: Spec = other ? { ...other, rounds: applyEdits(a.rounds, edits) } : { ...a, rounds: applyEdits(a.rounds, edits) };
  return { a: source(a), b: source(b) };
});

// ---- the mirror image of a diff, written here independently of the library ----
const swap = <T>(c: Change<T> | null): Change<T> | null => (c ? { old: c.new, new: c.old } : null);
const flipKind = <K extends string>(k: K): K => (k === 'added' ? 'removed' : k === 'removed' ? 'added' : k) as K;

function mirror(d: RevisionDiff): Omit<RevisionDiff, 'text'> {
  const h = d.header;
  return {
    version: d.version, same: d.same, old: d.new, new: d.old,
    header: {
      title: swap(h.title), designer: swap(h.designer), construction: swap(h.construction), gauge: swap(h.gauge), floatLimit: swap(h.floatLimit),
      sizes: { added: h.sizes.removed, removed: h.sizes.added, order: swap(h.sizes.order) },
      yarns: {
        added: h.yarns.removed, removed: h.yarns.added,
        recoloured: h.yarns.recoloured.map((y) => ({ name: y.name, old: y.new, new: y.old })),
        relabelled: h.yarns.relabelled.map((y) => ({ name: y.name, old: y.new, new: y.old })),
      },
    },
    sizes: d.sizes.map((s) => ({
      size: s.size, word: s.word, castOn: swap(s.castOn),
      rounds: s.rounds.map((r) => ({ kind: flipKind(r.kind), old: r.new, new: r.old, aspects: r.aspects, cellsChanged: r.cellsChanged })),
      renumbered: s.renumbered.map((r) => ({ old: r.new, new: r.old })),
      unchanged: s.unchanged,
      cells: s.cells.map((c) => ({ round: { old: c.round.new, new: c.round.old }, old: c.new, new: c.old })),
      cellsTotal: s.cellsTotal,
      columns: s.columns.map((c) => ({ kind: flipKind(c.kind), old: c.new, new: c.old })),
      summary: { added: s.summary.removed, removed: s.summary.added, changed: s.summary.changed, countsChanged: s.summary.countsChanged },
    })),
    diagnostics: { introduced: d.diagnostics.fixed, fixed: d.diagnostics.introduced, unchanged: d.diagnostics.unchanged },
    summary: {
      ...d.summary,
      roundsAdded: d.summary.roundsRemoved, roundsRemoved: d.summary.roundsAdded,
      diagnosticsIntroduced: d.summary.diagnosticsFixed, diagnosticsFixed: d.summary.diagnosticsIntroduced,
      linesAdded: d.summary.linesRemoved, linesRemoved: d.summary.linesAdded,
    },
  };
}
const withoutText = (d: RevisionDiff): Omit<RevisionDiff, 'text'> => { const { text: _text, ...rest } = d; return rest; };

/** Applies the hunks to the old source's lines (test's own patcher; the oracle is the new source). */
function rebuild(oldSource: string, t: TextDiff): string[] {
  const old = oldSource.split('\n');
  if (old[old.length - 1] === '') old.pop();
  const out: string[] = [];
  let next = 1;
  for (const h of t.hunks) {
    for (const l of h.lines) {
      if (l.old !== null) { while (next < l.old) out.push(old[next++ - 1]); next = l.old + 1; }
      if (l.kind !== 'removed') out.push(l.text);
    }
  }
  while (next <= old.length) out.push(old[next++ - 1]);
  return out;
}

const RUNS = { numRuns: 60 };

describe('diff properties', () => {
  it('diff(a, a) is empty', () => {
    fc.assert(fc.property(specArb, (s) => {
      const a = source(s);
      const d = diffRevisions(a, a);
      expect(d.same).toBe(true);
      expect(d.text.hunks).toEqual([]);
      expect(d.diagnostics.introduced.length + d.diagnostics.fixed.length).toBe(0);
      for (const z of d.sizes) {
        expect([z.rounds, z.cells, z.columns, z.renumbered, z.castOn]).toEqual([[], [], [], [], null]);
        expect(z.unchanged).toBe(d.old.sizes.find((x) => x.name === z.size)!.rounds);
      }
    }), RUNS);
  });

  it('diff(b, a) is the mirror image of diff(a, b); the text diff mirrors its counts', () => {
    fc.assert(fc.property(pairArb, ({ a, b }) => {
      const ab = diffRevisions(a, b), ba = diffRevisions(b, a);
      expect(withoutText(ba)).toEqual(mirror(ab));
      expect([ba.text.added, ba.text.removed]).toEqual([ab.text.removed, ab.text.added]);
    }), RUNS);
  });

  it('round-trips through JSON and conserves rounds', () => {
    fc.assert(fc.property(pairArb, ({ a, b }) => {
      const d = diffRevisions(a, b);
      expect(JSON.parse(JSON.stringify(d))).toEqual(d);
      for (const s of d.sizes) {
        const oldRounds = d.old.sizes.find((x) => x.name === s.size)!.rounds, newRounds = d.new.sizes.find((x) => x.name === s.size)!.rounds;
        const paired = s.unchanged + s.summary.changed;
        expect(paired + s.summary.removed).toBe(oldRounds);
        expect(paired + s.summary.added).toBe(newRounds);
        expect(s.cells.length).toBe(Math.min(s.cellsTotal, 2000));
        expect(s.rounds.reduce((t, r) => t + r.cellsChanged, 0)).toBe(s.cellsTotal);
      }
    }), RUNS);
  });

  it('rounds it does not mention have the same counts in both revisions (compiler JSON as the oracle)', () => {
    fc.assert(fc.property(pairArb, ({ a, b }) => {
      const d = diffRevisions(a, b);
      const oj = toCheckJson(compile(a)), nj = toCheckJson(compile(b));
      for (const s of d.sizes) {
        const mentionedOld = new Set<number>(), mentionedNew = new Set<number>();
        for (const r of s.rounds) { if (r.old) mentionedOld.add(r.old.number); if (r.new) mentionedNew.add(r.new.number); }
        for (const run of s.renumbered) {
          for (let n = run.old.first; n <= run.old.last; n++) mentionedOld.add(n);
          for (let n = run.new.first; n <= run.new.last; n++) mentionedNew.add(n);
        }
        const or = oj.sizes.find((x) => x.name === s.size)!.rounds, nr = nj.sizes.find((x) => x.name === s.size)!.rounds;
        for (const o of or) {
          if (mentionedOld.has(o.number)) continue;
          const n = nr.find((x) => x.number === o.number);
          expect(n && !mentionedNew.has(o.number)).toBe(true);
          expect(n).toEqual(o);
        }
        // Renumbered runs are unchanged rounds: the compiler agrees on their counts.
        for (const run of s.renumbered) {
          for (let k = 0; k <= run.old.last - run.old.first; k++) {
            const o = or.find((x) => x.number === run.old.first + k)!, n = nr.find((x) => x.number === run.new.first + k)!;
            expect({ ...n, number: 0 }).toEqual({ ...o, number: 0 });
          }
        }
      }
    }), RUNS);
  });

  it('never throws on arbitrary text on either side and still mirrors', () => {
    const noise = fc.oneof(fc.string({ maxLength: 200 }), pairArb.map((p) => p.a.slice(0, Math.floor(p.a.length / 2))));
    fc.assert(fc.property(noise, pairArb, (junk, { a }) => {
      const ab = diffRevisions(junk, a), ba = diffRevisions(a, junk);
      expect(withoutText(ba)).toEqual(mirror(ab));
    }), RUNS);
  });

  it('text hunks quote the sources at their line numbers and rebuild the new source', () => {
    fc.assert(fc.property(pairArb, ({ a, b }) => {
      const t = diffRevisions(a, b).text;
      const al = a.split('\n'), bl = b.split('\n');
      for (const h of t.hunks) {
        for (const l of h.lines) {
          if (l.old !== null) expect(al[l.old - 1]).toBe(l.text);
          if (l.new !== null) expect(bl[l.new - 1]).toBe(l.text);
        }
      }
      expect(rebuild(a, t).join('\n')).toBe(b.replace(/\n$/, ''));
      expect(t.added).toBe(t.hunks.flatMap((h) => h.lines).filter((l) => l.kind === 'added').length);
    }), RUNS);
  });
});
