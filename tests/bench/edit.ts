/**
 * The edit figure of `npm run bench`: re-compiling after a one-round edit of
 * a realistic 300-round pattern (tests/bench/edit-pattern.ts) with the
 * incremental compiler (shared/incremental.ts), as a fraction of a full
 * compile of the same text. Each timed incremental compile is an edit of
 * the text compiled just before it (two variants of the edit alternate), and
 * full compiles of the same texts are timed interleaved with them, so both
 * see the same machine load. A benchmark, not a test: it never fails on speed.
 */
import { compile, toCheckJson } from '../../shared/index.ts';
import { createIncrementalCompiler } from '../../shared/incremental.ts';
import { editOneRound, editPatternSource, type EditKind } from './edit-pattern.ts';

/** Timings of one kind of edit, in ms (medians over the runs). */
export interface EditFigure {
  kind: EditKind;
  fullMs: number;
  editMs: number;
  /** editMs / fullMs. */
  ratio: number;
  /** Statements re-parsed per edit, of all statements. */
  reparsed: number;
  statements: number;
  /** True when the edit reused the whole check (all sizes). */
  reusedCheck: boolean;
  /** Rounds (over all sizes) taken over from the previous check, and rounds worked again. */
  reusedRounds: number;
  workedRounds: number;
  /** Sizes whose round plan was carried over rather than planned again. */
  carriedPlans: number;
  /** The AST was the previous one with the edited line built anew. */
  patchedAst: boolean;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Times one kind of edit: `runs` incremental re-compiles against `runs` full compiles, interleaved. */
export function measureEdit(kind: EditKind, runs = 21, warm = 5): EditFigure {
  const base = editPatternSource();
  const texts = [editOneRound(base, kind, 0), editOneRound(base, kind, 1)];
  const inc = createIncrementalCompiler();
  // The results must be the fresh ones; a fast wrong answer is no figure.
  for (const t of texts) {
    if (JSON.stringify(toCheckJson(inc.compile(t))) !== JSON.stringify(toCheckJson(compile(t)))) throw new Error(`incremental result differs from a fresh compile (${kind} edit)`);
  }
  const full: number[] = [], edit: number[] = [];
  let stats = inc.lastStats;
  for (let i = 0; i < warm + runs; i++) {
    const text = texts[i % 2];
    let s = performance.now();
    compile(text);
    const f = performance.now() - s;
    s = performance.now();
    inc.compile(text);
    const e = performance.now() - s;
    stats = inc.lastStats;
    if (i >= warm) { full.push(f); edit.push(e); }
  }
  const fullMs = median(full), editMs = median(edit);
  return { kind, fullMs, editMs, ratio: editMs / fullMs, reparsed: stats.pieces - stats.reusedPieces, statements: stats.pieces, reusedCheck: stats.reusedCheck, reusedRounds: stats.reusedRounds, workedRounds: stats.workedRounds, carriedPlans: stats.carriedPlans, patchedAst: stats.patchedAst };
}
