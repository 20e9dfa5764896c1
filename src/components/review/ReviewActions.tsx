/**
 * The review status in words and the steps the person may take now:
 * the designer asks an invited editor for a review (or withdraws it) and
 * releases the approved revision under a version label; the editor
 * approves or asks for changes. Steps the status machine does not allow are
 * not offered; the server still decides, and its refusal is shown as is.
 */
import { useState, type FormEvent } from 'react';
import type { ApiRelease, ApiRevision } from '../../../shared/api-schemas';
import { errorText } from '../../api/client';
import { useReviewStep, type ReviewState } from '../../api/useReview';
import { Notice } from '../Notice';
import { nextLabel, statusSentence } from './review-words';

export interface ReviewActionsProps {
  patternId: string;
  role: string | undefined;
  review: ReviewState;
  revisions: ApiRevision[];
  releases: ApiRelease[];
}

export function ReviewActions({ patternId, role, review, revisions, releases }: ReviewActionsProps) {
  const step = useReviewStep(patternId);
  const [done, setDone] = useState<string | null>(null);
  const latest = revisions[0]?.number ?? 1;
  const { status } = review;
  // The revision the designer sent for review (the newest when the log does not say).
  const asked = [...review.events].reverse().find((e) => e.event === 'submit')?.revision ?? latest;
  const run = (s: Parameters<typeof step.mutate>[0], said: string) => {
    setDone(null);
    step.mutate(s, { onSuccess: (a) => setDone(a.delivered ? said : `${said} The mail could not be sent; tell them yourself.`) });
  };

  return (
    <section aria-labelledby="review-status-h" className="card p-4" data-testid="review-actions">
      <h2 id="review-status-h" className="text-sm font-semibold text-tide-900">Review status</h2>
      <p className="mt-1 text-sm text-tide-800" data-testid="review-status">{statusSentence(review, releases)}</p>
      {step.isError && <Notice tone="error" className="mt-3">{errorText(step.error)}</Notice>}
      {done && <Notice tone="success" className="mt-3">{done}</Notice>}

      {role === 'owner' && status !== 'in-review' && (
        <RequestForm key={`req-${latest}`} editors={review.editors} latest={latest} revisions={revisions} busy={step.isPending}
          onSubmit={(s) => run({ step: 'request', ...s }, 'Review requested.')} />
      )}
      {role === 'owner' && status === 'in-review' && (
        <div className="mt-3">
          <button type="button" className="btn btn-quiet btn-sm" disabled={step.isPending} onClick={() => run({ step: 'withdraw' }, 'Review request withdrawn.')}>
            Withdraw the review request
          </button>
        </div>
      )}
      {role === 'owner' && status === 'approved' && review.approvedRevision !== null && (
        <ReleaseForm key={`rel-${review.approvedRevision}`} revision={review.approvedRevision} suggested={nextLabel(releases.map((r) => r.label))} busy={step.isPending}
          onSubmit={(label, notes) => run({ step: 'release', label, notes: notes || undefined, revision: review.approvedRevision ?? undefined }, `Released as version ${label}.`)} />
      )}
      {role === 'editor' && status === 'in-review' && (
        <VerdictForm key={`ver-${asked}`} latest={asked} busy={step.isPending}
          onApprove={(message) => run({ step: 'approve', revision: asked, message: message || undefined }, `Revision #${asked} approved.`)}
          onChanges={(message) => run({ step: 'request-changes', revision: asked, message }, 'Changes requested.')} />
      )}
      {role === 'editor' && status !== 'in-review' && (
        <p className="mt-2 text-caption text-tide-600">
          {status === 'approved' ? 'Waiting for the designer to release the approved revision.' : 'You can approve or ask for changes once the designer asks you for a review.'}
        </p>
      )}
    </section>
  );
}

function RequestForm({ editors, latest, revisions, busy, onSubmit }: {
  editors: { id: number; name: string }[]; latest: number; revisions: ApiRevision[]; busy: boolean;
  onSubmit: (s: { editorId?: number; revision: number; message?: string }) => void;
}) {
  const [editor, setEditor] = useState('all');
  const [revision, setRevision] = useState(latest);
  const [message, setMessage] = useState('');
  if (editors.length === 0) {
    return <p className="mt-3 text-sm text-tide-700">Invite a technical editor below to ask for a review.</p>;
  }
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSubmit({ editorId: editor === 'all' ? undefined : Number(editor), revision, message: message.trim() || undefined });
  };
  return (
    <form onSubmit={submit} className="mt-3 grid grid-cols-2 gap-3">
      <div>
        <label htmlFor="rq-editor" className="field-label">Technical editor</label>
        <select id="rq-editor" className="field-input" value={editor} onChange={(e) => setEditor(e.target.value)}>
          {editors.length > 1 && <option value="all">Every invited editor</option>}
          {editors.map((e) => <option key={e.id} value={e.id}>{e.name}</option>)}
        </select>
      </div>
      <div>
        <label htmlFor="rq-rev" className="field-label">Revision</label>
        <select id="rq-rev" className="field-input" value={revision} onChange={(e) => setRevision(Number(e.target.value))}>
          {revisions.map((r) => <option key={r.number} value={r.number}>#{r.number}{r.message ? ` — ${r.message}` : ''}</option>)}
        </select>
      </div>
      <div className="col-span-2">
        <label htmlFor="rq-msg" className="field-label">Note for the editor (optional)</label>
        <textarea id="rq-msg" className="field-input" rows={2} value={message} onChange={(e) => setMessage(e.target.value)} maxLength={5000} />
      </div>
      <div className="col-span-2"><button type="submit" className="btn btn-primary" disabled={busy}>Request review</button></div>
    </form>
  );
}

function ReleaseForm({ revision, suggested, busy, onSubmit }: { revision: number; suggested: string; busy: boolean; onSubmit: (label: string, notes: string) => void }) {
  const [label, setLabel] = useState(suggested);
  const [notes, setNotes] = useState('');
  const valid = /^(0|[1-9][0-9]{0,3})(\.(0|[1-9][0-9]{0,3})){0,2}$/.test(label.trim());
  return (
    <form className="mt-3 grid grid-cols-[10rem_1fr] gap-3" onSubmit={(e) => { e.preventDefault(); if (valid) onSubmit(label.trim(), notes.trim()); }}>
      <p className="col-span-2 text-sm text-tide-800">Revision #{revision} is approved. Releasing freezes it for knitters.</p>
      <div>
        <label htmlFor="rel-label" className="field-label">Version label</label>
        <input id="rel-label" className="field-input" value={label} onChange={(e) => setLabel(e.target.value)} aria-invalid={!valid}
          aria-describedby="rel-label-help" />
        <p id="rel-label-help" className="mt-1 text-caption text-tide-600">Numbers and dots, e.g. 1.0 or 1.1</p>
      </div>
      <div>
        <label htmlFor="rel-notes" className="field-label">Release notes (optional)</label>
        <input id="rel-notes" className="field-input" value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={1000} />
      </div>
      <div className="col-span-2"><button type="submit" className="btn btn-primary" disabled={busy || !valid}>Release version {label.trim() || '…'}</button></div>
    </form>
  );
}

function VerdictForm({ latest, busy, onApprove, onChanges }: { latest: number; busy: boolean; onApprove: (m: string) => void; onChanges: (m: string) => void }) {
  const [message, setMessage] = useState('');
  const [missing, setMissing] = useState(false);
  return (
    <form className="mt-3 space-y-3" onSubmit={(e) => e.preventDefault()}>
      <div>
        <label htmlFor="verdict-msg" className="field-label">Message to the designer (needed when asking for changes)</label>
        <textarea id="verdict-msg" className="field-input" rows={2} value={message} maxLength={5000} aria-invalid={missing || undefined}
          onChange={(e) => { setMessage(e.target.value); setMissing(false); }} />
        {missing && <p className="mt-1 text-caption text-glasswort-700">Say what should change.</p>}
      </div>
      <div className="flex gap-2">
        <button type="button" className="btn btn-primary" disabled={busy} onClick={() => onApprove(message.trim())}>Approve revision #{latest}</button>
        <button type="button" className="btn btn-quiet" disabled={busy}
          onClick={() => { if (message.trim()) onChanges(message.trim()); else setMissing(true); }}>
          Request changes
        </button>
      </div>
    </form>
  );
}
