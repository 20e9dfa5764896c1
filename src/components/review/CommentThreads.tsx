/**
 * Comment threads on one revision: a composer for the round or line chosen
 * in the diff (or a general remark), each thread with its anchor, replies,
 * a reply box and resolve / reopen. Errata reported by knitters appear as
 * threads marked "Erratum".
 */
import { useEffect, useRef, useState, type FormEvent } from 'react';
import type { ApiComment } from '../../../shared/api-schemas';
import { errorText } from '../../api/client';
import { useAddComment, useComments, useReply, useResolve, type NewComment } from '../../api/useReview';
import { fullTime, relativeTime } from '../format';
import { Notice } from '../Notice';
import { anchorLabel } from './review-words';

export interface CommentThreadsProps {
  patternId: string;
  revision: number;
  word: 'Round' | 'Row';
  /** The round or line picked in the diff; the composer opens for it. */
  anchor: Omit<NewComment, 'body'> | null;
  onClearAnchor: () => void;
}

/** Threads (first comments) with their replies, in order. */
export function threadsOf(comments: ApiComment[]): { root: ApiComment; replies: ApiComment[] }[] {
  const roots = comments.filter((c) => !c.parentId);
  return roots.map((root) => ({ root, replies: comments.filter((c) => c.parentId === root.id) }));
}

function Composer({ patternId, revision, anchor, word, onDone }: { patternId: string; revision: number; anchor: Omit<NewComment, 'body'>; word: 'Round' | 'Row'; onDone: () => void }) {
  const add = useAddComment(patternId, revision);
  const [body, setBody] = useState('');
  const [round, setRound] = useState('');
  const ref = useRef<HTMLTextAreaElement>(null);
  useEffect(() => { ref.current?.focus(); }, [anchor]);
  const isGeneral = anchor.round === undefined && anchor.fromLine === undefined;
  const where = anchorLabel({ round: anchor.round ?? null, fromLine: anchor.fromLine ?? null, toLine: anchor.toLine ?? null }, word);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!body.trim()) return;
    const picked = Number(round);
    const at = isGeneral && Number.isInteger(picked) && picked > 0 ? { round: picked } : anchor;
    add.mutate({ ...at, body: body.trim() }, { onSuccess: () => { setBody(''); onDone(); } });
  };
  return (
    <form onSubmit={submit} className="rounded-stitch border border-lavender-200 bg-lavender-50 p-3" data-testid="comment-composer">
      <label htmlFor="new-comment" className="field-label">{where ? `Comment on ${where.toLowerCase()} of revision #${revision}` : `Comment on revision #${revision}`}</label>
      <textarea id="new-comment" ref={ref} className="field-input" rows={3} value={body} maxLength={5000} onChange={(e) => setBody(e.target.value)} />
      {add.isError && <Notice tone="error" className="mt-2">{errorText(add.error)}</Notice>}
      <div className="mt-2 flex items-center gap-2">
        {isGeneral && (
          <label className="flex items-center gap-1.5 text-caption text-tide-700">
            {word} (optional)
            <input type="number" min={1} className="field-input w-20 py-1" value={round} onChange={(e) => setRound(e.target.value)} />
          </label>
        )}
        <button type="submit" className="btn btn-primary btn-sm" disabled={add.isPending || !body.trim()}>Add comment</button>
        <button type="button" className="btn btn-quiet btn-sm" onClick={onDone}>Cancel</button>
      </div>
    </form>
  );
}

function Thread({ patternId, revision, root, replies, word }: { patternId: string; revision: number; root: ApiComment; replies: ApiComment[]; word: 'Round' | 'Row' }) {
  const reply = useReply(patternId, revision);
  const resolve = useResolve(patternId, revision);
  const [body, setBody] = useState('');
  const where = anchorLabel(root, word);
  const error = reply.error ?? resolve.error;
  return (
    <li className={`rounded-stitch border p-3 ${root.resolved ? 'border-tide-200 bg-tide-50' : 'border-tide-200 bg-white'}`} data-testid="thread">
      <div className="flex flex-wrap items-center gap-2 text-caption">
        {where && <span className="rounded-full bg-lavender-100 px-2 py-0.5 font-medium text-lavender-800">{where}{root.size ? ` · size ${root.size}` : ''}</span>}
        {root.kind === 'erratum' && <span className="rounded-full bg-glasswort-50 px-2 py-0.5 font-medium text-glasswort-800">Erratum</span>}
        {root.resolved && <span className="rounded-full bg-samphire-50 px-2 py-0.5 font-medium text-samphire-800">Resolved</span>}
        <button type="button" className="btn btn-quiet btn-sm ml-auto" disabled={resolve.isPending}
          onClick={() => resolve.mutate({ commentId: root.id, resolved: !root.resolved })}>
          {root.resolved ? 'Reopen' : 'Resolve'}
        </button>
      </div>
      <ul className="mt-2 space-y-2">
        {[root, ...replies].map((c) => (
          <li key={c.id} className="text-sm">
            <span className="font-medium">{c.author.name}</span>
            <span className="text-caption text-tide-600"> · <span title={fullTime(c.createdAt)}>{relativeTime(c.createdAt)}</span></span>
            <p className="whitespace-pre-wrap text-tide-900">{c.body}</p>
          </li>
        ))}
      </ul>
      {error && <Notice tone="error" className="mt-2">{errorText(error)}</Notice>}
      <form className="mt-2 flex items-end gap-2" onSubmit={(e) => { e.preventDefault(); if (body.trim()) reply.mutate({ commentId: root.id, body: body.trim() }, { onSuccess: () => setBody('') }); }}>
        <div className="flex-1">
          <label htmlFor={`reply-${root.id}`} className="sr-only">Reply to {root.author.name}{where ? ` on ${where.toLowerCase()}` : ''}</label>
          <textarea id={`reply-${root.id}`} className="field-input" rows={1} placeholder="Reply…" value={body} maxLength={5000} onChange={(e) => setBody(e.target.value)} />
        </div>
        <button type="submit" className="btn btn-quiet btn-sm" disabled={reply.isPending || !body.trim()}>Reply</button>
      </form>
    </li>
  );
}

export function CommentThreads({ patternId, revision, word, anchor, onClearAnchor }: CommentThreadsProps) {
  const comments = useComments(patternId, revision);
  const [general, setGeneral] = useState(false);
  const threads = comments.data ? threadsOf(comments.data) : [];
  const open = threads.filter((t) => !t.root.resolved).length;
  return (
    <section aria-labelledby="threads-h" className="space-y-3 p-4">
      <div className="flex items-center gap-2">
        <h2 id="threads-h" className="text-sm font-semibold text-tide-900">Comments on revision #{revision}</h2>
        {comments.data && <span className="text-caption text-tide-600">{open} open · {threads.length - open} resolved</span>}
        {!anchor && !general && <button type="button" className="btn btn-quiet btn-sm ml-auto" onClick={() => setGeneral(true)}>General comment</button>}
      </div>
      {anchor ? <Composer patternId={patternId} revision={revision} anchor={anchor} word={word} onDone={onClearAnchor} />
        : general && <Composer patternId={patternId} revision={revision} anchor={{}} word={word} onDone={() => setGeneral(false)} />}
      {comments.isPending ? <p role="status" className="text-sm text-tide-600">Loading comments…</p>
        : comments.isError ? <Notice tone="error">{errorText(comments.error)}</Notice>
          : threads.length === 0 ? <p className="text-sm text-tide-600">No comments yet. Pick a {word.toLowerCase()} or a line number to comment on it.</p>
            : <ul className="space-y-2">{threads.map((t) => <Thread key={t.root.id} patternId={patternId} revision={revision} word={word} {...t} />)}</ul>}
    </section>
  );
}
