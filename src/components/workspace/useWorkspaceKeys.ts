/**
 * Window-level workspace shortcuts, so they work wherever focus is: Mod+S
 * saves (never the browser's "save page"), Alt+digit picks a pane (Alt+0
 * returns to the editor), F1 (or ? outside text fields) opens the shortcut
 * list.
 */
import { useEffect, useRef } from 'react';

export interface WorkspaceKeyHandlers {
  onSave: () => void;
  onPane: (index: number) => void;
  onEditor: () => void;
  onHelp: () => void;
}

function isTextTarget(t: EventTarget | null): boolean {
  if (!(t instanceof HTMLElement)) return false;
  return t.isContentEditable || t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.tagName === 'SELECT';
}

export function useWorkspaceKeys(handlers: WorkspaceKeyHandlers): void {
  const ref = useRef(handlers);
  ref.current = handlers;
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      if (mod && !e.altKey && !e.shiftKey && e.key.toLowerCase() === 's') {
        e.preventDefault();
        if (!document.querySelector('dialog[open]')) ref.current.onSave();
        return;
      }
      if (document.querySelector('dialog[open]')) return; // a dialog has the keyboard
      if (e.altKey && !e.ctrlKey && !e.metaKey && /^Digit[0-9]$/.test(e.code)) {
        e.preventDefault();
        const n = Number(e.code.slice(5));
        if (n === 0) ref.current.onEditor();
        else ref.current.onPane(n - 1);
      } else if (e.key === 'F1' || (e.key === '?' && !isTextTarget(e.target))) {
        e.preventDefault();
        ref.current.onHelp();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);
}
