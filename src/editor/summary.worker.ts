/**
 * Summary worker: the summary (finished size, yarn estimate, float report)
 * and the backing-stitch planner. A worker of its own, started the first
 * time the summary pane opens, so the yarn and sizing arithmetic never adds
 * to the workspace's first download; it compiles the text it is sent (the
 * compile worker's stitch-level model stays in that worker).
 */
import { compile } from '../../shared';
import { summarize } from '../../shared/render/summary';
import { planBacking } from '../../shared/render/planner';
import type { SummaryWorkerAnswer, SummaryWorkerMessage } from './protocol';

const post = (m: SummaryWorkerAnswer) => (self as unknown as Worker).postMessage(m);
const bug = (what: string, err: unknown) =>
  `The ${what} could not be made (${err instanceof Error ? err.message : String(err)}). This is a bug in Loopwright; the counts and problems are still right.`;
let latest: { id: number; source: string } | null = null;

self.onmessage = (e: MessageEvent<SummaryWorkerMessage>) => {
  const msg = e.data;
  if (msg.type === 'summarize') {
    latest = { id: msg.id, source: msg.source };
    try {
      post({ type: 'summary', id: msg.id, summary: summarize(compile(msg.source)) });
    } catch (err) {
      post({ type: 'summary', id: msg.id, summary: null, problem: bug('summary', err) });
    }
    return;
  }
  if (!latest) {
    post({ type: 'plan', request: msg.request, source: '', plan: null, problem: 'The pattern has not been summarised yet; try again in a moment.' });
    return;
  }
  try {
    const plan = planBacking({ source: latest.source, first: msg.first, last: msg.last, segment: msg.segment || undefined });
    post({ type: 'plan', request: msg.request, source: latest.source, plan });
  } catch (err) {
    post({ type: 'plan', request: msg.request, source: latest.source, plan: null, problem: bug('plan', err) });
  }
};
