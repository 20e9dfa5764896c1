/**
 * Compile the editor's text in a Web Worker, debounced.
 *
 * `schedule(source)` is called on every change; the worker is asked after
 * `delayMs` (default 150 ms) of quiet, and the newest answer wins (answers
 * to older requests are dropped). The worker lives as long as the component.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import type { CompiledView } from './protocol';

/** Default quiet time before compiling, in milliseconds. */
export const COMPILE_DEBOUNCE_MS = 150;

export interface Compiler {
  /** The newest compile answer, or null before the first one. */
  view: CompiledView | null;
  /** True while a newer text than `view.source` waits to be compiled. */
  pending: boolean;
  /** Ask for a compile of `source` (debounced); `immediate` skips the wait. */
  schedule: (source: string, immediate?: boolean) => void;
}

export function useCompiler(delayMs = COMPILE_DEBOUNCE_MS): Compiler {
  const worker = useRef<Worker | null>(null);
  const nextId = useRef(0);
  const wanted = useRef(0);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  // A request made before the worker exists (child effects run first).
  const queued = useRef<{ id: number; source: string } | null>(null);
  const [view, setView] = useState<CompiledView | null>(null);
  const [pending, setPending] = useState(false);

  useEffect(() => {
    const w = new Worker(new URL('./compile.worker.ts', import.meta.url), { type: 'module', name: 'loopwright-compile' });
    w.onmessage = (e: MessageEvent<CompiledView>) => {
      if (e.data.id < wanted.current) return; // an older text; a newer answer follows
      setView(e.data);
      setPending(false);
    };
    worker.current = w;
    if (queued.current) w.postMessage(queued.current);
    queued.current = null;
    return () => {
      if (timer.current) clearTimeout(timer.current);
      w.terminate();
      worker.current = null;
    };
  }, []);

  const schedule = useCallback(
    (source: string, immediate = false) => {
      if (timer.current) clearTimeout(timer.current);
      const id = ++nextId.current;
      wanted.current = id;
      setPending(true);
      const send = () => {
        if (worker.current) worker.current.postMessage({ id, source });
        else queued.current = { id, source };
      };
      if (immediate) send();
      else timer.current = setTimeout(send, delayMs);
    },
    [delayMs],
  );

  return { view, pending, schedule };
}
