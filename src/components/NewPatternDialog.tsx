/** Dialog asking for a new pattern's title; on success opens the workspace. */
import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { useCreatePattern } from '../api/usePatterns';
import { errorText } from '../api/client';
import { Dialog } from './Dialog';
import { Field } from './Field';
import { Notice } from './Notice';

export function NewPatternDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const create = useCreatePattern();
  const navigate = useNavigate();
  const [title, setTitle] = useState('');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!title.trim()) return;
    create.mutate({ title: title.trim() }, { onSuccess: (data) => navigate(`/patterns/${data.pattern.id}`) });
  };
  return (
    <Dialog open={open} title="New pattern" onClose={() => { create.reset(); onClose(); }}>
      <form onSubmit={submit} className="space-y-4">
        {create.isError && <Notice tone="error">{errorText(create.error)}</Notice>}
        <Field label="Title" name="title" required value={title} onChange={(e) => setTitle(e.target.value)} autoFocus
          help="You can change it later in the pattern's header." />
        <div className="flex justify-end gap-2">
          <button type="button" className="btn btn-quiet" onClick={onClose}>Cancel</button>
          <button type="submit" className="btn btn-primary" disabled={!title.trim() || create.isPending}>
            {create.isPending ? 'Creating…' : 'Create and open'}
          </button>
        </div>
      </form>
    </Dialog>
  );
}
