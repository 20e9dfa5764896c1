/**
 * Instructions pane: the written instructions of one size as the compiler
 * writes them (shared/render, in the compile worker): cast-on, one entry per
 * round or run of rounds with the stitch count whenever it changes, notes,
 * and the key of abbreviations. A click on an entry's label moves the
 * editor to its line; the entry of the line under the cursor is marked.
 * Printing the page prints only these instructions.
 */
import { memo, useEffect, useRef } from 'react';
import type { Span } from '../../../shared';
import type { InstructionsMessage } from '../../editor/protocol';

export interface InstructionsPaneProps {
  message: InstructionsMessage | null;
  sizes: string[];
  size: string | null;
  onSize: (size: string) => void;
  stale: boolean;
  cursorLine: number;
  onJump: (span: Span) => void;
}

export const InstructionsPane = memo(function InstructionsPane({ message, sizes, size, onSize, stale, cursorLine, onJump }: InstructionsPaneProps) {
  const current = useRef<HTMLLIElement>(null);
  const ins = message?.instructions ?? null;
  const shownSize = message?.size ?? size ?? sizes[0] ?? '';
  const currentIndex = ins ? ins.entries.findIndex((e) => e.span.line === cursorLine) : -1;
  useEffect(() => { current.current?.scrollIntoView({ block: 'nearest' }); }, [currentIndex]);

  return (
    <div className="flex h-full min-h-0 flex-col">
      <div className="no-print flex flex-wrap items-center gap-3 border-b border-tide-200 px-4 py-2 text-caption text-tide-700">
        <div role="group" aria-label="Size" className="flex overflow-hidden rounded-stitch border border-tide-300">
          {sizes.map((s) => (
            <button key={s} type="button" aria-pressed={s === shownSize} onClick={() => onSize(s)}
              className={`px-2.5 py-1 font-medium ${s === shownSize ? 'bg-lavender-700 text-white' : 'bg-white text-tide-800 hover:bg-tide-50'}`}>
              {s}
            </button>
          ))}
        </div>
        {stale && <span role="status">Rewriting…</span>}
        <button type="button" className="btn btn-quiet btn-sm ml-auto" onClick={() => window.print()} disabled={!ins}>Print</button>
      </div>
      <div className="print-area min-h-0 flex-1 overflow-auto px-6 py-5" data-testid="instructions">
        {!message ? (
          <p className="text-sm text-tide-600" role="status">Writing the instructions…</p>
        ) : !ins ? (
          <p className="text-sm text-tide-700">{message.problem}</p>
        ) : (
          <article className="max-w-prose text-[0.9rem] leading-relaxed text-tide-900">
            <h2 className="text-lg font-semibold">{ins.title ?? 'Untitled pattern'}</h2>
            <p className="text-caption font-medium uppercase tracking-wide text-tide-600">
              {ins.size === 'one size' ? 'One size' : `Size ${ins.size}`} · {ins.construction === 'flat' ? 'worked flat' : 'worked in the round'}
            </p>
            <p className="mt-3">{ins.castOn}</p>
            <ol className="mt-3 space-y-1.5">
              {ins.entries.map((e, i) => (
                <li key={`${e.first}-${e.last}`} ref={i === currentIndex ? current : undefined}
                  className={`rounded-stitch px-2 py-1 ${i === currentIndex ? 'bg-lavender-50 shadow-[inset_3px_0_0] shadow-lavender-600' : ''}`}>
                  <button type="button" onClick={() => onJump(e.span)} className="font-semibold text-lavender-800 hover:underline"
                    aria-label={`${e.label}: go to its line`}>
                    {e.label}:
                  </button>{' '}
                  {e.text}
                  {e.counts && (
                    <span className="ml-1 whitespace-nowrap font-medium text-samphire-800">
                      ({e.counts.backing > 0 ? `${e.counts.total} sts: ${e.counts.front} + ${e.counts.backing} backing` : `${e.counts.total} sts`})
                    </span>
                  )}
                  {e.note && <span className="mt-0.5 block text-caption italic text-tide-700">Note: {e.note}</span>}
                </li>
              ))}
            </ol>
            {ins.key.length > 0 && (
              <section className="mt-6" aria-label="Key">
                <h3 className="text-caption font-semibold uppercase tracking-wide text-tide-600">Key</h3>
                <dl className="mt-2 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-caption">
                  {ins.key.map((k) => (
                    <div key={k.abbreviation} className="contents">
                      <dt className="font-mono font-semibold">{k.abbreviation}</dt>
                      <dd className="text-tide-800">{k.meaning}</dd>
                    </div>
                  ))}
                </dl>
              </section>
            )}
          </article>
        )}
      </div>
    </div>
  );
});
