/**
 * Compile worker: lexes each new text at once (for colouring) and compiles
 * it after a quiet spell, all off the main thread so typing never waits for
 * the compiler. Texts that arrive while one is being compiled make the
 * older one moot: only the newest is compiled.
 */
import { compile, highlightTokens, KEYWORDS, STITCH_NAMES } from '../../shared';
import type { CompiledView, HighlightToken, SourceMessage, WorkerAnswer } from './protocol';

const post = (m: WorkerAnswer) => (self as unknown as Worker).postMessage(m);
let latest: SourceMessage | null = null;
let timer: ReturnType<typeof setTimeout> | null = null;

function tokensOf(source: string): HighlightToken[] {
  try {
    return highlightTokens(source);
  } catch {
    return []; // colouring is a nicety; the compile below reports real problems
  }
}

const emptyHeader: CompiledView['header'] = {
  title: null, designer: null, sizes: [], construction: 'round', gauge: null, yarns: [], floatLimit: { value: 1, unit: 'in' },
};

function compileLatest(): void {
  timer = null;
  const msg = latest;
  latest = null;
  if (!msg) return;
  const started = performance.now();
  let view: CompiledView;
  try {
    const result = compile(msg.source);
    view = {
      type: 'compiled',
      id: msg.id,
      source: msg.source,
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
      type: 'compiled', id: msg.id, source: msg.source, ok: false, header: emptyHeader, diagnostics: [], sizes: [],
      elapsedMs: performance.now() - started, crash: err instanceof Error ? err.message : String(err),
    };
  }
  post(view);
}

self.onmessage = (e: MessageEvent<SourceMessage>) => {
  const msg = e.data;
  post({ type: 'tokens', id: msg.id, source: msg.source, tokens: tokensOf(msg.source) });
  latest = msg;
  if (timer) clearTimeout(timer);
  timer = setTimeout(compileLatest, Math.max(0, msg.delayMs));
};

post({ type: 'vocabulary', stitches: [...STITCH_NAMES], keywords: [...KEYWORDS] });
