/**
 * Semantic diff of two pattern revisions (public API). See README.md for
 * inputs, outputs and invariants.
 */
export { diffRevisions, diffCompiled, DEFAULT_MAX_CELLS } from './diff-revisions';
export { formatDiffText } from './format';
export { diffText, MAX_TEXT_EDITS } from './text';
export { locateColumns } from './columns';
export { MAX_LCS_CELLS } from './align';
export { DIFF_VERSION, ROUND_ASPECTS } from './types';
export type {
  Change, RoundState, RoundAspect, RoundChange, CellState, CellChange, ColumnState, ColumnChange, RenumberedRun,
  SizeDiff, YarnState, HeaderDiff, DiagnosticRef, TextLine, TextHunk, TextDiff, RevisionFacts, RevisionDiff, DiffOptions,
} from './types';
