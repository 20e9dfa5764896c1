/**
 * Unsaved changes kept in this browser's localStorage, one entry per
 * pattern, so a closed tab, a crash or a sign-out loses nothing.
 * A draft remembers the revision it was edited from, so saving it later
 * still goes through the server's stale-save check.
 */

/** An unsaved text and the revision it started from. `savedAt` is ms since the epoch. */
export interface Draft {
  baseRevision: number;
  source: string;
  savedAt: number;
}

const draftKey = (patternId: string) => `loopwright:draft:${patternId}`;
const asideKey = (patternId: string) => `loopwright:set-aside:${patternId}`;

function read(key: string): Draft | null {
  try {
    const raw = localStorage.getItem(key);
    if (!raw) return null;
    const d = JSON.parse(raw) as Partial<Draft>;
    if (typeof d.source !== 'string' || typeof d.baseRevision !== 'number') return null;
    return { baseRevision: d.baseRevision, source: d.source, savedAt: typeof d.savedAt === 'number' ? d.savedAt : 0 };
  } catch {
    return null;
  }
}

function write(key: string, draft: Draft): boolean {
  try {
    localStorage.setItem(key, JSON.stringify(draft));
    return true;
  } catch {
    return false; // storage full or disabled; the beforeunload warning still protects the text
  }
}

/** The unsaved draft of a pattern, if any. */
export const readDraft = (patternId: string): Draft | null => read(draftKey(patternId));
/** Keep the unsaved text of a pattern; false when the browser refused to store it. */
export const writeDraft = (patternId: string, draft: Draft): boolean => write(draftKey(patternId), draft);
/** Forget the draft (after a save, or when the text equals the saved revision). */
export function clearDraft(patternId: string): void {
  try { localStorage.removeItem(draftKey(patternId)); } catch { /* nothing to clear */ }
}

/** Set aside a version the designer replaced (taking someone else's revision), so it can come back. */
export const writeSetAside = (patternId: string, draft: Draft): boolean => write(asideKey(patternId), draft);
/** The version last set aside for a pattern, if any. */
export const readSetAside = (patternId: string): Draft | null => read(asideKey(patternId));
