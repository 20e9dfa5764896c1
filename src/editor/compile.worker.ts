/**
 * Compile worker: runs the shared compiler off the main thread so typing
 * never waits for it. Requests can pile up while a compile runs; only the
 * newest is compiled (older ones are already out of date).
 */
import { compile } from '../../shared';
import type { CompileRequest, CompiledView } from './protocol';

let latest: CompileRequest | null = null;
let scheduled = false;

function run(): void {
  scheduled = false;
  const req = latest;
  latest = null;
  if (!req) return;
  const started = performance.now();
  let view: CompiledView;
  try {
    const result = compile(req.source);
    view = {
      id: req.id,
      source: req.source,
      ok: result.ok,
      header: result.header,
      diagnostics: result.diagnostics,
      sizes: result.sizes.map((s) => ({ name: s.name, castOn: s.castOn, rounds: s.rounds })),
      elapsedMs: performance.now() - started,
    };
  } catch (err) {
    // compile() must not throw on user input; if it does, say so plainly
    // instead of leaving the panes silently stale.
    view = {
      id: req.id,
      source: req.source,
      ok: false,
      header: { title: null, designer: null, sizes: [], construction: 'round', gauge: null, yarns: [], floatLimit: { value: 1, unit: 'in' } },
      diagnostics: [],
      sizes: [],
      elapsedMs: performance.now() - started,
      crash: err instanceof Error ? err.message : String(err),
    };
  }
  (self as unknown as Worker).postMessage(view);
}

self.onmessage = (e: MessageEvent<CompileRequest>) => {
  latest = e.data;
  // Yield once so a burst of queued messages collapses to the newest.
  if (!scheduled) {
    scheduled = true;
    setTimeout(run, 0);
  }
};
