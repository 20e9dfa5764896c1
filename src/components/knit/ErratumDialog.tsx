/** Report an erratum on a round of a release: it reaches the designer as a comment and a mail. */
import { useState } from 'react';
import { errorText } from '../../api/client';
import { useReportErratum } from '../../api/useKnitting';
import { Dialog } from '../Dialog';
import { Notice } from '../Notice';

export interface ErratumDialogProps {
  patternId: string;
  label: string;
  size: string;
  round: number | null;
  word: 'Round' | 'Row';
  onClose: () => void;
  onSent: (message: string) => void;
}

export function ErratumDialog({ patternId, label, size, round, word, onClose, onSent }: ErratumDialogProps) {
  const report = useReportErratum(patternId, label);
  const [body, setBody] = useState('');
  return (
    <Dialog open={round !== null} title={`Report a problem in ${word.toLowerCase()} ${round ?? ''}`} onClose={onClose}>
      <form onSubmit={(e) => {
        e.preventDefault();
        if (round === null || !body.trim()) return;
        report.mutate({ round, size, body: body.trim() }, {
          onSuccess: () => { setBody(''); onSent(`Thank you: the designer has your report on ${word.toLowerCase()} ${round}.`); },
        });
      }}>
        <p className="text-sm text-tide-700">Version {label}, size {size}. Say what you expected and what the pattern says (counts help).</p>
        <label htmlFor="erratum-body" className="field-label mt-3">What is wrong?</label>
        <textarea id="erratum-body" className="field-input" rows={4} maxLength={5000} value={body} onChange={(e) => setBody(e.target.value)} />
        {report.isError && <Notice tone="error" className="mt-2">{errorText(report.error)}</Notice>}
        <div className="mt-3 flex justify-end gap-2">
          <button type="button" className="btn btn-quiet" onClick={onClose}>Cancel</button>
          <button type="submit" className="btn btn-primary" disabled={report.isPending || !body.trim()}>Send report</button>
        </div>
      </form>
    </Dialog>
  );
}
