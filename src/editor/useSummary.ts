/**
 * The summary pane's worker (summary.worker.ts): started the first time
 * `active` is true, then sent every compiled text while the pane shows.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import type { PlanAnswer, SummaryMessage, SummaryWorkerAnswer, SummaryWorkerMessage } from './protocol';

export interface SummaryLink {
  summary: SummaryMessage | null;
  plan: PlanAnswer | null;
  /** Ask for backing columns over rounds first–last (optionally one segment) of the newest text. */
  requestPlan: (first: number, last: number, segment?: string) => void;
}

/** `compiled`: the newest text the compile worker checked, with its id. */
export function useSummary(active: boolean, compiled: { id: number; source: string } | null): SummaryLink {
  const worker = useRef<Worker | null>(null);
  const planRequest = useRef(0);
  const [summary, setSummary] = useState<SummaryMessage | null>(null);
  const [plan, setPlan] = useState<PlanAnswer | null>(null);

  useEffect(() => () => { worker.current?.terminate(); worker.current = null; }, []);

  const send = useCallback((m: SummaryWorkerMessage) => {
    if (!worker.current) {
      const w = new Worker(new URL('./summary.worker.ts', import.meta.url), { type: 'module', name: 'loopwright-summary' });
      w.onmessage = (e: MessageEvent<SummaryWorkerAnswer>) => {
        const a = e.data;
        if (a.type === 'summary') setSummary(a);
        else if (a.request === planRequest.current) setPlan(a);
      };
      worker.current = w;
    }
    worker.current.postMessage(m);
  }, []);

  const id = compiled?.id;
  const source = compiled?.source;
  useEffect(() => {
    if (active && id !== undefined && source !== undefined) send({ type: 'summarize', id, source });
  }, [active, id, source, send]);

  const requestPlan = useCallback((first: number, last: number, segment?: string) => {
    const request = ++planRequest.current;
    setPlan(null);
    send({ type: 'plan', request, first, last, segment });
  }, [send]);

  return { summary, plan, requestPlan };
}
