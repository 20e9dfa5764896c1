/**
 * The editing session of one pattern: which revision the text is based on,
 * whether it differs from that revision (dirty), the local draft that keeps
 * unsaved text across reloads, and the warning before leaving the page.
 *
 * Invariant: whenever the text differs from the saved revision it is also
 * in localStorage (written within {@link DRAFT_DELAY_MS}), tagged with the
 * revision it started from.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { Revision } from '../../api/types';
import { clearDraft, readDraft, writeDraft, type Draft } from './drafts';

/** Quiet time before the draft is written, in milliseconds. */
export const DRAFT_DELAY_MS = 300;

export interface EditingSession {
  /** Text the editor starts with (the draft when one was restored). */
  initialDoc: string;
  /** The draft restored at open, if any (for the notice). */
  restored: Draft | null;
  baseRevision: number;
  dirty: boolean;
  /** Current text (a ref, so reading it never re-renders). */
  docRef: React.RefObject<string>;
  /** Call on every edit. */
  onDocChange: (doc: string) => void;
  /** The text was saved as `revision` (or the designer took `revision` as is). */
  markSaved: (revision: { number: number; source: string }) => void;
}

export function useEditingSession(patternId: string, latest: Revision | null): EditingSession {
  const start = useMemo(() => {
    const saved = latest ? { number: latest.number, source: latest.source } : { number: 0, source: '' };
    const draft = readDraft(patternId);
    if (draft && draft.source !== saved.source) {
      // An older base means the draft may miss newer work; saving it will
      // meet the server's 409 and offer a comparison, so keep its own base.
      const knownSource = draft.baseRevision === saved.number ? saved.source : null;
      return { doc: draft.source, restored: draft, base: draft.baseRevision, savedSource: knownSource };
    }
    if (draft) clearDraft(patternId);
    return { doc: saved.source, restored: null, base: saved.number, savedSource: saved.source as string | null };
    // Computed once per opened pattern: later refetches must not reset the editor.
  }, [patternId]);

  const [baseRevision, setBaseRevision] = useState(start.base);
  const savedSource = useRef<string | null>(start.savedSource);
  const base = useRef(start.base);
  const docRef = useRef(start.doc);
  const [dirty, setDirty] = useState(start.savedSource === null || start.doc !== start.savedSource);
  const dirtyRef = useRef(dirty);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const flush = useCallback(() => {
    if (timer.current) { clearTimeout(timer.current); timer.current = null; }
    if (dirtyRef.current) writeDraft(patternId, { baseRevision: base.current, source: docRef.current, savedAt: Date.now() });
    else clearDraft(patternId);
  }, [patternId]);

  const onDocChange = useCallback((doc: string) => {
    docRef.current = doc;
    const isDirty = savedSource.current === null || doc !== savedSource.current;
    if (isDirty !== dirtyRef.current) { dirtyRef.current = isDirty; setDirty(isDirty); }
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(flush, DRAFT_DELAY_MS);
  }, [flush]);

  const markSaved = useCallback((revision: { number: number; source: string }) => {
    base.current = revision.number;
    savedSource.current = revision.source;
    setBaseRevision(revision.number);
    const isDirty = docRef.current !== revision.source;
    dirtyRef.current = isDirty;
    setDirty(isDirty);
    flush();
  }, [flush]);

  useEffect(() => {
    const beforeUnload = (e: BeforeUnloadEvent) => {
      if (!dirtyRef.current) return;
      flush();
      e.preventDefault();
      e.returnValue = ''; // some browsers still need this to show the prompt
    };
    window.addEventListener('beforeunload', beforeUnload);
    return () => {
      window.removeEventListener('beforeunload', beforeUnload);
      flush(); // leaving the page inside the app: keep the text
    };
  }, [flush]);

  return { initialDoc: start.doc, restored: start.restored, baseRevision, dirty, docRef, onDocChange, markSaved };
}
