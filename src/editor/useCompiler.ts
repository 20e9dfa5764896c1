/**
 * The workspace's link to its compile worker. `update(source)` is called on
 * every change: the worker answers with tokens at once and with a compile
 * after `delayMs` (default 150 ms) of quiet. Answers to older texts are
 * dropped. The worker lives as long as the component.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import type { ChartMessage, CompiledView, InstructionsMessage, TokensMessage, ViewSettings, VocabularyMessage, WorkerAnswer } from './protocol';

/** Default quiet time before compiling, in milliseconds. */
export const COMPILE_DEBOUNCE_MS = 150;

export interface Compiler {
  /** The newest compile answer, or null before the first one. */
  view: CompiledView | null;
  /** True while a newer text than `view.source` waits to be compiled. */
  pending: boolean;
  /** Send a new text; `immediate` compiles without the wait. */
  update: (source: string, immediate?: boolean) => void;
  /** The newest chart drawing (for the settings last sent), or null. */
  chart: ChartMessage | null;
  /** The newest written instructions (for the settings last sent), or null. */
  instructions: InstructionsMessage | null;
  /** Tell the worker which views to draw. */
  setViews: (settings: ViewSettings) => void;
}

export interface CompilerListeners {
  onTokens: (m: TokensMessage) => void;
  onVocabulary: (m: VocabularyMessage) => void;
}

export function useCompiler(listeners: CompilerListeners, delayMs = COMPILE_DEBOUNCE_MS): Compiler {
  const worker = useRef<Worker | null>(null);
  const nextId = useRef(0);
  const wanted = useRef(0);
  const listen = useRef(listeners);
  listen.current = listeners;
  // Messages sent before the worker exists (child effects run first).
  const queued = useRef<unknown[]>([]);
  const [view, setView] = useState<CompiledView | null>(null);
  const [pending, setPending] = useState(false);
  const [chart, setChart] = useState<ChartMessage | null>(null);
  const [instructions, setInstructions] = useState<InstructionsMessage | null>(null);


  useEffect(() => {
    const w = new Worker(new URL('./compile.worker.ts', import.meta.url), { type: 'module', name: 'loopwright-compile' });
    w.onmessage = (e: MessageEvent<WorkerAnswer>) => {
      const m = e.data;
      if (m.type === 'vocabulary') listen.current.onVocabulary(m);
      else if (m.type === 'tokens') { if (m.id === wanted.current) listen.current.onTokens(m); }
      else if (m.type === 'chart') setChart(m);
      else if (m.type === 'instructions') setInstructions(m);

      else if (m.id === wanted.current) { setView(m); setPending(false); }
    };
    worker.current = w;
    for (const m of queued.current) w.postMessage(m);
    queued.current = [];
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  const update = useCallback((source: string, immediate = false) => {
    const id = ++nextId.current;
    wanted.current = id;
    setPending(true);
    const msg = { type: 'source', id, source, delayMs: immediate ? 0 : delayMs };
    if (worker.current) worker.current.postMessage(msg);
    else queued.current.push(msg);
  }, [delayMs]);

  const setViews = useCallback((settings: ViewSettings) => {
    const msg = { type: 'settings', settings };
    if (worker.current) worker.current.postMessage(msg);
    else queued.current.push(msg);
  }, []);

  return { view, pending, update, chart, instructions, setViews };
}
