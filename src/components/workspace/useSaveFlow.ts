/**
 * Saving a revision from the workspace: the message dialog, the save
 * itself on the revision the text is based on, and a stale save (HTTP 409):
 * keep mine (save again on top of the newer revision) or take theirs (the
 * designer's text is set aside in this browser and can be brought back).
 * Nothing is overwritten on the server and nothing is lost here.
 */
import { useCallback, useEffect, useState, type RefObject } from 'react';
import { errorText } from '../../api/client';
import type { Revision } from '../../api/types';
import { conflictOf, useSaveRevision } from '../../api/usePatterns';
import type { EditorHandle } from '../../editor/LoopEditor';
import { writeSetAside } from './drafts';
import type { EditingSession } from './useEditingSession';

export interface SaveFlow {
  /** The revision the header shows as saved. */
  savedRevision: Revision | null;
  dialogOpen: boolean;
  openDialog: () => void;
  closeDialog: () => void;
  saving: boolean;
  /** An error other than a conflict, in plain words. */
  error: string | null;
  /** Save the current text with `message` on `baseRevision` (default: the session's). */
  save: (message: string, baseRevision?: number) => void;
  conflict: { theirs: Revision; message: string } | null;
  closeConflict: () => void;
  takeTheirs: () => void;
  /** The designer's own text set aside by "take theirs", until brought back or dismissed. */
  setAside: string | null;
  bringBack: () => void;
  dismissSetAside: () => void;
  /** A short confirmation to show for a few seconds. */
  toast: string | null;
}

export function useSaveFlow(opts: {
  patternId: string;
  latest: Revision | null;
  session: EditingSession;
  editor: RefObject<EditorHandle | null>;
  canEdit: boolean;
  onSaved: () => void;
}): SaveFlow {
  const { patternId, session, editor, canEdit, onSaved } = opts;
  const mutation = useSaveRevision(patternId);
  const [savedRevision, setSavedRevision] = useState<Revision | null>(opts.latest);
  const [dialogOpen, setDialogOpen] = useState(false);
  const [conflict, setConflict] = useState<{ theirs: Revision; message: string } | null>(null);
  const [setAside, setSetAside] = useState<string | null>(null);
  const [toast, setToast] = useState<string | null>(null);

  useEffect(() => {
    if (!toast) return;
    const t = setTimeout(() => setToast(null), 4000);
    return () => clearTimeout(t);
  }, [toast]);

  const { reset } = mutation;
  const openDialog = useCallback(() => { if (canEdit) { reset(); setDialogOpen(true); } }, [canEdit, reset]);

  const save = (message: string, baseRevision = session.baseRevision) => {
    const source = session.docRef.current;
    mutation.mutate({ source, baseRevision, message }, {
      onSuccess: ({ revision }) => {
        session.markSaved({ number: revision.number, source });
        setSavedRevision(revision);
        setDialogOpen(false);
        setConflict(null);
        onSaved();
        setToast(`Saved as revision #${revision.number}.`);
      },
      onError: (err) => {
        const theirs = conflictOf(err);
        if (theirs) { setDialogOpen(false); setConflict({ theirs, message }); }
      },
    });
  };

  const takeTheirs = () => {
    if (!conflict) return;
    const mine = session.docRef.current;
    writeSetAside(patternId, { baseRevision: session.baseRevision, source: mine, savedAt: Date.now() });
    setSetAside(mine);
    editor.current?.replaceDoc(conflict.theirs.source);
    session.markSaved({ number: conflict.theirs.number, source: conflict.theirs.source });
    setSavedRevision(conflict.theirs);
    setConflict(null);
    reset();
  };

  return {
    savedRevision,
    dialogOpen,
    openDialog,
    closeDialog: () => setDialogOpen(false),
    saving: mutation.isPending,
    error: mutation.isError && !conflictOf(mutation.error) ? errorText(mutation.error) : null,
    save,
    conflict,
    closeConflict: () => setConflict(null),
    takeTheirs,
    setAside,
    bringBack: () => { if (setAside !== null) editor.current?.replaceDoc(setAside); setSetAside(null); },
    dismissSetAside: () => setSetAside(null),
    toast,
  };
}
