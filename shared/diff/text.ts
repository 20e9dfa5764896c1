/**
 * The line diff of two sources, with the `diff` package (a minimal edit
 * script, Myers' algorithm): unified hunks plus each line's number on both
 * sides, so a client can draw them side by side.
 */
import { structuredPatch } from 'diff';
import type { TextDiff, TextHunk, TextLine } from './types';

/**
 * Edit scripts longer than this many lines are not searched for (the search
 * is quadratic in the worst case); the sources are then shown as one hunk
 * that replaces everything. Deterministic, unlike a time limit.
 */
export const MAX_TEXT_EDITS = 1000;

const splitLines = (s: string): string[] => {
  if (s === '') return [];
  const lines = s.split(/\r?\n/);
  if (lines[lines.length - 1] === '') lines.pop();
  return lines;
};

function wholeReplacement(a: string, b: string): TextDiff {
  const al = splitLines(a), bl = splitLines(b);
  const lines: TextLine[] = [
    ...al.map((text, i): TextLine => ({ kind: 'removed', old: i + 1, new: null, text })),
    ...bl.map((text, i): TextLine => ({ kind: 'added', old: null, new: i + 1, text })),
  ];
  const hunks = lines.length ? [{ oldStart: al.length ? 1 : 0, oldLines: al.length, newStart: bl.length ? 1 : 0, newLines: bl.length, lines }] : [];
  return { hunks, added: bl.length, removed: al.length, replacedWhole: true };
}

/** Line diff of `a` (old) and `b` (new) with `context` lines around each change (default 3). */
export function diffText(a: string, b: string, context = 3): TextDiff {
  if (a === b) return { hunks: [], added: 0, removed: 0, replacedWhole: false };
  const patch = structuredPatch('old', 'new', a, b, undefined, undefined, { context, maxEditLength: MAX_TEXT_EDITS, stripTrailingCr: true });
  if (!patch) return wholeReplacement(a, b);
  let added = 0, removed = 0;
  const hunks: TextHunk[] = patch.hunks.map((h) => {
    // A unified diff gives an empty side's start as the line before it.
    let o = h.oldLines === 0 ? h.oldStart + 1 : h.oldStart;
    let n = h.newLines === 0 ? h.newStart + 1 : h.newStart;
    const lines: TextLine[] = [];
    for (const raw of h.lines) {
      const mark = raw[0], text = raw.slice(1);
      if (mark === '\\') continue; // "\ No newline at end of file"
      if (mark === '+') { lines.push({ kind: 'added', old: null, new: n++, text }); added++; }
      else if (mark === '-') { lines.push({ kind: 'removed', old: o++, new: null, text }); removed++; }
      else lines.push({ kind: 'context', old: o++, new: n++, text });
    }
    return { oldStart: h.oldStart, oldLines: h.oldLines, newStart: h.newStart, newLines: h.newLines, lines };
  });
  return { hunks, added, removed, replacedWhole: false };
}
