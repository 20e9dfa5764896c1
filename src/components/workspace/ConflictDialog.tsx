/**
 * A save met a newer revision (HTTP 409). Shows the designer's text beside
 * the newer revision, lines that differ tinted, and lets them choose:
 * keep theirs own text and save it on top of the newer revision, or take the
 * newer revision (their own text is set aside and can be brought back or
 * downloaded). Nothing is lost either way.
 */
import { useMemo } from 'react';
import { diffLines } from 'diff';
import type { Revision } from '../../api/types';
import { Dialog } from '../Dialog';
import { Notice } from '../Notice';
import { fullTime, relativeTime } from '../format';

export interface ConflictDialogProps {
  open: boolean;
  mine: string;
  theirs: Revision;
  saving: boolean;
  error: string | null;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
  onClose: () => void;
}

interface Line { text: string; changed: boolean }

/** Lines of each side with the ones missing from the other side marked. */
function sideBySide(mine: string, theirs: string): { left: Line[]; right: Line[]; changed: number } {
  const left: Line[] = [];
  const right: Line[] = [];
  let changed = 0;
  for (const part of diffLines(mine, theirs)) {
    const lines = part.value.replace(/\n$/, '').split('\n');
    if (part.added) { right.push(...lines.map((text) => ({ text, changed: true }))); changed += lines.length; }
    else if (part.removed) { left.push(...lines.map((text) => ({ text, changed: true }))); changed += lines.length; }
    else {
      left.push(...lines.map((text) => ({ text, changed: false })));
      right.push(...lines.map((text) => ({ text, changed: false })));
    }
  }
  return { left, right, changed };
}

/** Offer the designer's own text as a .loop file. */
export function downloadSource(text: string, name: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: 'text/plain;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

function Column({ title, lines, tone, label }: { title: string; lines: Line[]; tone: string; label: string }) {
  return (
    <section aria-label={label} className="flex min-w-0 flex-col">
      <h3 className="mb-1.5 text-caption font-semibold text-tide-700">{title}</h3>
      <pre className="h-[50vh] overflow-auto rounded-stitch border border-tide-200 bg-white py-2 font-mono text-[12px] leading-5 text-tide-900">
        {lines.map((l, i) => (
          <div key={i} className={`px-3 ${l.changed ? tone : ''}`}>
            <span className="sr-only">{l.changed ? 'changed: ' : ''}</span>
            {l.text || ' '}
          </div>
        ))}
      </pre>
    </section>
  );
}

export function ConflictDialog({ open, mine, theirs, saving, error, onKeepMine, onTakeTheirs, onClose }: ConflictDialogProps) {
  const diff = useMemo(() => sideBySide(mine, theirs.source), [mine, theirs.source]);
  const who = theirs.author?.name ?? 'Someone';
  return (
    <Dialog open={open} title={`Revision #${theirs.number} was saved while you were editing`} onClose={onClose} width="w-[min(72rem,95vw)]">
      <p className="text-sm text-tide-800">
        {who} saved revision #{theirs.number}{' '}
        <span title={fullTime(theirs.createdAt)}>{relativeTime(theirs.createdAt)}</span>
        {theirs.message ? <> with the message “{theirs.message}”</> : null}. Your text was not saved and nothing was overwritten.
        {diff.changed > 0 ? ` ${diff.changed} line${diff.changed === 1 ? ' differs' : 's differ'} (tinted).` : ' The texts are the same.'}
      </p>
      {error && <Notice tone="error" className="mt-3">{error}</Notice>}
      <div className="mt-4 grid grid-cols-2 gap-4">
        <Column title="Your version (unsaved)" label="Your version" lines={diff.left} tone="bg-lavender-100" />
        <Column title={`Revision #${theirs.number} by ${who}`} label={`Revision ${theirs.number}`} lines={diff.right} tone="bg-samphire-100" />
      </div>
      <div className="mt-4 flex flex-wrap items-center justify-end gap-2">
        <button type="button" className="btn btn-quiet mr-auto" onClick={() => downloadSource(mine, `my-version-${Date.now()}.loop`)}>
          Download my version
        </button>
        <button type="button" className="btn btn-quiet" onClick={onTakeTheirs} disabled={saving}>
          Take revision #{theirs.number} (set mine aside)
        </button>
        <button type="button" className="btn btn-primary" onClick={onKeepMine} disabled={saving}>
          {saving ? 'Saving…' : `Keep mine and save on top of #${theirs.number}`}
        </button>
      </div>
    </Dialog>
  );
}
