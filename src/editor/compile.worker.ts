/**
 * Compile worker: lexes each new text at once (for colouring), compiles it
 * after a quiet spell, and draws the views the page shows (the chart), all
 * off the main thread so typing never waits for the compiler. Texts that
 * arrive while one is being compiled make the older one moot: only the
 * newest is compiled.
 */
import { compile, highlightTokens, KEYWORDS, STITCH_NAMES, type CompileResult } from '../../shared';
import { buildChart } from '../../shared/render/chart-model';
import { renderChartSvg } from '../../shared/render/chart-svg';
import { renderBackSvg } from '../../shared/render/back-svg';
import type { ChartMessage, CompiledView, HighlightToken, SourceMessage, ViewSettings, WorkerAnswer, WorkerMessage } from './protocol';

const post = (m: WorkerAnswer) => (self as unknown as Worker).postMessage(m);
let latest: SourceMessage | null = null;
let timer: ReturnType<typeof setTimeout> | null = null;
let settings: ViewSettings = { chart: null };
let compiled: { id: number; result: CompileResult } | null = null;

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

/** Draws the chart the page asked for from the newest compile. */
function drawViews(): void {
  const want = settings.chart;
  if (!want || !compiled) return;
  const { id, result } = compiled;
  const size = want.size && result.sizes.some((s) => s.name === want.size) ? want.size : result.sizes[0]?.name;
  const base = { type: 'chart' as const, id, size: size ?? '', side: want.side, cell: want.cell };
  let answer: ChartMessage;
  if (!size) {
    answer = { ...base, svg: null, problem: 'There is nothing to chart yet: cast on and write the first round.' };
  } else {
    try {
      const model = buildChart(result, size);
      answer = !model || model.rows.length === 0
        ? { ...base, svg: null, problem: 'There is nothing to chart yet: cast on and write the first round.' }
        : { ...base, svg: want.side === 'back' ? renderBackSvg(model, { cell: want.cell }) : renderChartSvg(model, { cell: want.cell }) };
    } catch (err) {
      answer = { ...base, svg: null, problem: `The chart could not be drawn (${err instanceof Error ? err.message : String(err)}). This is a bug in Loopwright; the counts and problems are still right.` };
    }
  }
  post(answer);
}

function compileLatest(): void {
  timer = null;
  const msg = latest;
  latest = null;
  if (!msg) return;
  const started = performance.now();
  let view: CompiledView;
  try {
    const result = compile(msg.source);
    compiled = { id: msg.id, result };
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
    compiled = null;
    view = {
      type: 'compiled', id: msg.id, source: msg.source, ok: false, header: emptyHeader, diagnostics: [], sizes: [],
      elapsedMs: performance.now() - started, crash: err instanceof Error ? err.message : String(err),
    };
  }
  post(view);
  drawViews();
}

self.onmessage = (e: MessageEvent<WorkerMessage>) => {
  const msg = e.data;
  if (msg.type === 'settings') {
    settings = msg.settings;
    drawViews();
    return;
  }
  post({ type: 'tokens', id: msg.id, source: msg.source, tokens: tokensOf(msg.source) });
  latest = msg;
  if (timer) clearTimeout(timer);
  timer = setTimeout(compileLatest, Math.max(0, msg.delayMs));
};

post({ type: 'vocabulary', stitches: [...STITCH_NAMES], keywords: [...KEYWORDS] });
