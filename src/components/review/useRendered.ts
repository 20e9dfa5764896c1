/**
 * Draws a saved revision in the render worker: `useRendered(source, size)`
 * answers with the chart SVG, rounds and (when asked) instructions of that
 * size. The worker lives as long as the component; answers to older
 * requests are dropped.
 */
import { useEffect, useRef, useState } from 'react';
import type { RenderAnswer } from './render-protocol';

/** Rendering state: null answer while the first drawing is on its way. */
export interface Rendered { answer: RenderAnswer | null; pending: boolean }

export function useRendered(source: string | null, size: string | null, options: { cell?: number; instructions?: boolean } = {}): Rendered {
  const worker = useRef<Worker | null>(null);
  const wanted = useRef(0);
  const [answer, setAnswer] = useState<RenderAnswer | null>(null);
  const [pending, setPending] = useState(false);
  const cell = options.cell ?? 16;
  const instructions = options.instructions ?? false;

  useEffect(() => {
    const w = new Worker(new URL('./render.worker.ts', import.meta.url), { type: 'module', name: 'loopwright-render' });
    w.onmessage = (e: MessageEvent<RenderAnswer>) => {
      if (e.data.id !== wanted.current) return;
      setAnswer(e.data);
      setPending(false);
    };
    worker.current = w;
    return () => { w.terminate(); worker.current = null; };
  }, []);

  useEffect(() => {
    if (source === null || !worker.current) return;
    const id = ++wanted.current;
    setPending(true);
    worker.current.postMessage({ id, source, size, cell, instructions });
  }, [source, size, cell, instructions]);

  return { answer, pending };
}
