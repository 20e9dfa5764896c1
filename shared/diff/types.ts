/**
 * The JSON shape of a revision diff: what `diffRevisions` returns, what
 * `GET /api/patterns/:id/diff?from=N&to=M` sends and what
 * `npm run loop -- diff A B --json` prints. Plain data only (no Map, no
 * typed array, no undefined fields), so `JSON.parse(JSON.stringify(d))`
 * deep-equals `d`.
 *
 * Mirror invariant: `diffRevisions(b, a)` is `diffRevisions(a, b)` with every
 * `old` and `new` swapped and `added` <-> `removed`, `introduced` <-> `fixed`
 * (the text part excepted: see README.md).
 */
import type { FloatInfo, PatternHeader } from '../types';

/** Version of this JSON shape; raised on any incompatible change. */
export const DIFF_VERSION = 1;

/** A value before and after. */
export interface Change<T> { old: T; new: T }

/** A round (or row) of one revision, as the diff shows it. */
export interface RoundState {
  /** Round or row number in that revision (1-based). */
  number: number;
  side: 'RS' | 'WS';
  /** Stitches on the needle after the round: front (fabric), backing, and both. */
  front: number;
  backing: number;
  total: number;
  longestFloat: FloatInfo | null;
  note: string | null;
  /** Source lines (1-based, inclusive) of the line that gave the round its instructions, in that revision. */
  line: number;
  endLine: number;
}

/** What differs between two paired rounds; listed in this order. */
export type RoundAspect = 'counts' | 'stitches' | 'backing' | 'floats' | 'markers' | 'side' | 'note';

/** The fixed order in which aspects are listed. */
export const ROUND_ASPECTS: readonly RoundAspect[] = ['counts', 'stitches', 'backing', 'floats', 'markers', 'side', 'note'];

/**
 * One round that is new, gone, or different. `added`: `old` is null.
 * `removed`: `new` is null. `changed`: both set, `aspects` non-empty.
 */
export interface RoundChange {
  kind: 'added' | 'removed' | 'changed';
  old: RoundState | null;
  new: RoundState | null;
  /** What differs (changed rounds only; empty otherwise). */
  aspects: RoundAspect[];
  /** Chart cells of this round whose stitch or yarn differs (changed rounds only; 0 otherwise). */
  cellsChanged: number;
}

/**
 * One chart cell: a front stitch of a round. `stitch` is 1-based and counts
 * front stitches in right-side working order (from the chart's right edge;
 * backing stitches take no width and are not cells). `op` is the stitch
 * table's name ("k", "k2tog", "close ssk") of the stitch as it shows on the
 * right side, as a chart draws it (on a WS row a purled stitch shows as
 * "k": knit and purl, k2tog and p2tog, ssk and ssp swapped); `yarn` the
 * yarn's short name.
 */
export interface CellState { stitch: number; op: string; yarn: string }

/**
 * A cell whose stitch or yarn differs in a pair of rounds (`round.old` and
 * `round.new`, the paired rounds' numbers). A side is null when that round
 * has no stitch there (it has fewer stitches).
 */
export interface CellChange { round: Change<number>; old: CellState | null; new: CellState | null }

/**
 * A backing column: set up in `firstRound` after `after` front stitches (in
 * right-side order), on the needle up to and including `lastRound`.
 */
export interface ColumnState { yarn: string; after: number; firstRound: number; lastRound: number }

/**
 * A backing column that is new, gone, moved (same yarn and rounds, another
 * place) or changed (same yarn and place, other rounds).
 */
export interface ColumnChange { kind: 'added' | 'removed' | 'moved' | 'changed'; old: ColumnState | null; new: ColumnState | null }

/** Consecutive rounds that did not change but carry other numbers (a round was inserted or removed before them). */
export interface RenumberedRun { old: { first: number; last: number }; new: { first: number; last: number } }

/** Everything that differs in one size present in both revisions. */
export interface SizeDiff {
  size: string;
  /** 'row' when either revision is worked flat, 'round' otherwise. */
  word: 'round' | 'row';
  castOn: Change<number> | null;
  /** Added, removed and changed rounds, in working order. */
  rounds: RoundChange[];
  /** Unchanged rounds that moved to other numbers. */
  renumbered: RenumberedRun[];
  /** Rounds paired with a round of the other revision and identical to it. */
  unchanged: number;
  /** Changed cells in working order, at most `options.maxCells` of them. */
  cells: CellChange[];
  /** All changed cells (may exceed cells.length). */
  cellsTotal: number;
  columns: ColumnChange[];
  summary: { added: number; removed: number; changed: number; countsChanged: number };
}

/** A yarn as declared. */
export type YarnState = PatternHeader['yarns'][number];

/** Header fields that differ; a field is null when unchanged. */
export interface HeaderDiff {
  title: Change<string | null> | null;
  designer: Change<string | null> | null;
  construction: Change<'round' | 'flat'> | null;
  gauge: Change<PatternHeader['gauge']> | null;
  floatLimit: Change<PatternHeader['floatLimit']> | null;
  sizes: { added: string[]; removed: string[]; order: Change<string[]> | null };
  yarns: {
    added: YarnState[];
    removed: YarnState[];
    recoloured: { name: string; old: string; new: string }[];
    relabelled: { name: string; old: string; new: string }[];
  };
}

/** A diagnostic as the diff lists it (position in its own revision). */
export interface DiagnosticRef {
  code: string;
  severity: 'error' | 'warning' | 'info';
  size: string | null;
  message: string;
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
}

/** One line of a text hunk with its line number on each side (null where it does not exist). */
export interface TextLine { kind: 'context' | 'added' | 'removed'; old: number | null; new: number | null; text: string }

/** A hunk of the line diff; starts and lengths as in a unified diff. */
export interface TextHunk { oldStart: number; oldLines: number; newStart: number; newLines: number; lines: TextLine[] }

/** The line diff of the two sources. */
export interface TextDiff {
  hunks: TextHunk[];
  added: number;
  removed: number;
  /** True when the sources differ too much for a line-by-line alignment; the one hunk then replaces everything. */
  replacedWhole: boolean;
}

/** Facts about one revision. */
export interface RevisionFacts {
  ok: boolean;
  errors: number;
  warnings: number;
  sizes: { name: string; castOn: number; rounds: number }[];
}

/** The whole diff between two revisions. */
export interface RevisionDiff {
  version: typeof DIFF_VERSION;
  /** True when nothing differs: no semantic change and identical text. */
  same: boolean;
  old: RevisionFacts;
  new: RevisionFacts;
  header: HeaderDiff;
  /** Sizes present in both revisions (in the new revision's order). */
  sizes: SizeDiff[];
  diagnostics: { introduced: DiagnosticRef[]; fixed: DiagnosticRef[]; unchanged: number };
  text: TextDiff;
  summary: {
    headerChanged: boolean;
    roundsAdded: number;
    roundsRemoved: number;
    roundsChanged: number;
    countsChanged: number;
    cellsChanged: number;
    columnsChanged: number;
    diagnosticsIntroduced: number;
    diagnosticsFixed: number;
    linesAdded: number;
    linesRemoved: number;
  };
}

/** Options of `diffRevisions`. */
export interface DiffOptions {
  /** Diff only this size (both revisions are compiled for it alone). */
  size?: string;
  /** Most changed cells listed per size; default 2000. `cellsTotal` still counts all. */
  maxCells?: number;
  /** Lines of context around text hunks; default 3. */
  context?: number;
}
