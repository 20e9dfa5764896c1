/**
 * A modal dialog on the native <dialog> element: focus is trapped and
 * Escape closes it (both by the browser), the title labels it, and focus
 * returns to where it was when it closes.
 */
import { useEffect, useId, useRef, type ReactNode } from 'react';

export interface DialogProps {
  open: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
  /** Tailwind width class; defaults to a comfortable form width. */
  width?: string;
}

export function Dialog({ open, title, onClose, children, width = 'w-[28rem]' }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    if (open && !el.open) {
      const previous = document.activeElement as HTMLElement | null;
      el.showModal();
      return () => previous?.focus?.();
    }
    if (!open && el.open) el.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      onCancel={(e) => { e.preventDefault(); onClose(); }}
      className={`m-auto max-h-[90vh] max-w-[95vw] rounded-lg border border-tide-200 bg-white p-0 text-tide-900 shadow-float ${width}`}
    >
      {open && (
        <div className="flex max-h-[90vh] flex-col">
          <div className="flex items-center justify-between border-b border-tide-200 px-5 py-3">
            <h2 id={titleId} className="text-base font-semibold">{title}</h2>
            <button type="button" className="btn btn-quiet btn-sm" onClick={onClose} aria-label="Close">
              Close
            </button>
          </div>
          <div className="min-h-0 overflow-auto px-5 py-4">{children}</div>
        </div>
      )}
    </dialog>
  );
}
