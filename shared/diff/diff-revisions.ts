/**
 * The entry point: compile two revisions' sources and diff them (header,
 * per-size rounds, cells and backing columns, diagnostics, text).
 */
import { compile, type CompileResult } from '../index';
import { commonTokens, diffDiagnostics } from './diagnostics';
import { diffHeader, isHeaderChanged } from './header';
import { SizeView } from './round-view';
import { diffSize, pairRounds, type RoundPairing } from './size-diff';
import { diffText } from './text';
import { DIFF_VERSION, type DiffOptions, type RevisionDiff, type RevisionFacts, type SizeDiff } from './types';

/** Default of {@link DiffOptions.maxCells}. */
export const DEFAULT_MAX_CELLS = 2000;

function facts(r: CompileResult, diagnostics: CompileResult['diagnostics']): RevisionFacts {
  const errors = diagnostics.filter((d) => d.severity === 'error').length;
  return {
    ok: errors === 0,
    errors,
    warnings: diagnostics.filter((d) => d.severity === 'warning').length,
    sizes: r.sizes.map((s) => ({ name: s.name, castOn: s.castOn, rounds: s.rounds.length })),
  };
}

/**
 * Diffs two revisions from their sources. Compiles each once (only
 * `options.size` when given; a revision without that size then simply has
 * no model for it and the request's "no such size" finding is left out).
 * Pure and deterministic; never throws on user input. The result is
 * JSON-serialisable (see types.ts for the shape and the mirror invariant).
 */
export function diffRevisions(oldSource: string, newSource: string, options: DiffOptions = {}): RevisionDiff {
  const opts = options.size !== undefined ? { size: options.size } : {};
  return diffCompiled(oldSource, compile(oldSource, opts), newSource, compile(newSource, opts), options);
}

/**
 * Diffs two revisions already compiled (by `compile` from shared/index.ts,
 * with the same `size` option or none). Use it when the results are at hand.
 */
export function diffCompiled(oldSource: string, oldResult: CompileResult, newSource: string, newResult: CompileResult, options: DiffOptions = {}): RevisionDiff {
  const maxCells = Math.max(0, options.maxCells ?? DEFAULT_MAX_CELLS);
  const dropRequestOnly = (r: CompileResult) => (options.size !== undefined ? r.diagnostics.filter((d) => d.code !== 'LW208') : r.diagnostics);
  const oldFlat = oldResult.header.construction === 'flat', newFlat = newResult.header.construction === 'flat';
  const oldSizes = new Map(oldResult.sizes.map((s) => [s.name, s]));
  const sizes: SizeDiff[] = [];
  const pairings = new Map<string, RoundPairing>();
  for (const nm of newResult.sizes) {
    const om = oldSizes.get(nm.name);
    if (!om) continue;
    const a = new SizeView(om, oldFlat), b = new SizeView(nm, newFlat);
    const pairing = pairRounds(a, b);
    pairings.set(nm.name, pairing);
    sizes.push(diffSize(nm.name, a, b, pairing, maxCells));
  }
  const header = diffHeader(oldResult.header, newResult.header);
  const oldDiags = dropRequestOnly(oldResult), newDiags = dropRequestOnly(newResult);
  const diagnostics = diffDiagnostics(oldDiags, newDiags, { bySize: pairings, common: commonTokens([...pairings.values()]) });
  const text = diffText(oldSource, newSource, options.context ?? 3);
  const sum = (f: (s: SizeDiff) => number) => sizes.reduce((t, s) => t + f(s), 0);
  const summary = {
    headerChanged: isHeaderChanged(header),
    roundsAdded: sum((s) => s.summary.added),
    roundsRemoved: sum((s) => s.summary.removed),
    roundsChanged: sum((s) => s.summary.changed),
    countsChanged: sum((s) => s.summary.countsChanged),
    cellsChanged: sum((s) => s.cellsTotal),
    columnsChanged: sum((s) => s.columns.length),
    diagnosticsIntroduced: diagnostics.introduced.length,
    diagnosticsFixed: diagnostics.fixed.length,
    linesAdded: text.added,
    linesRemoved: text.removed,
  };
  const semanticSame = !summary.headerChanged && summary.roundsAdded + summary.roundsRemoved + summary.roundsChanged + summary.columnsChanged === 0
    && sizes.every((s) => !s.castOn && s.renumbered.length === 0) && summary.diagnosticsIntroduced + summary.diagnosticsFixed === 0;
  return {
    version: DIFF_VERSION,
    same: semanticSame && text.hunks.length === 0,
    old: facts(oldResult, oldDiags),
    new: facts(newResult, newDiags),
    header, sizes, diagnostics, text, summary,
  };
}
