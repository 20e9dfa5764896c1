/** Ask for a revision message, then save. Errors other than a conflict show here. */
import { useState, type FormEvent } from 'react';
import { Dialog } from '../Dialog';
import { Field } from '../Field';
import { Notice } from '../Notice';

export interface SaveDialogProps {
  open: boolean;
  baseRevision: number;
  saving: boolean;
  error: string | null;
  /** Errors and warnings of the text being saved (saving with errors is allowed, but said). */
  errors: number;
  onSave: (message: string) => void;
  onClose: () => void;
}

export function SaveDialog({ open, baseRevision, saving, error, errors, onSave, onClose }: SaveDialogProps) {
  const [message, setMessage] = useState('');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSave(message.trim());
  };
  return (
    <Dialog open={open} title="Save a revision" onClose={onClose}>
      <form onSubmit={submit} className="space-y-4">
        {error && <Notice tone="error">{error}</Notice>}
        {errors > 0 && (
          <Notice tone="warning">
            The pattern still has {errors} error{errors === 1 ? '' : 's'}. You can save work in progress; the revision records them.
          </Notice>
        )}
        <Field label="What changed?" name="message" value={message} onChange={(e) => setMessage(e.target.value)} autoFocus
          placeholder="e.g. Fix the crown decreases in size L" help={`Saved as the revision after #${baseRevision}.`} maxLength={500} />
        <div className="flex justify-end gap-2">
          <button type="button" className="btn btn-quiet" onClick={onClose}>Cancel</button>
          <button type="submit" className="btn btn-primary" disabled={saving}>{saving ? 'Saving…' : 'Save revision'}</button>
        </div>
      </form>
    </Dialog>
  );
}
