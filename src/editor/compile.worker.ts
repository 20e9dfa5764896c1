/**
 * Compile worker: lexes each new text at once (for colouring), compiles it
 * after a quiet spell, and draws the views the page shows (chart, written
 * instructions), all off the main thread so typing never waits for the
 * compiler. Texts that arrive while one is being compiled make the older
 * one moot: only the newest is compiled. The renderers load the first time
 * a view asks for them.
 */
import { compile, highlightTokens, KEYWORDS, STITCH_NAMES, type CompileResult } from '../../shared';
import type { ChartMessage, CompiledView, HighlightToken, InstructionsMessage, SourceMessage, ViewSettings, WorkerAnswer, WorkerMessage } from './protocol';

const loadRenderers = () => import('./renderers');

const post = (m: WorkerAnswer) => (self as unknown as Worker).postMessage(m);
let latest: SourceMessage | null = null;
let timer: ReturnType<typeof setTimeout> | null = null;
let settings: ViewSettings = { chart: null, instructions: null };
let compiled: { id: number; source: string; result: CompileResult } | null = null;
const NOTHING_YET = 'There is nothing to show yet: cast on and write the first round.';
const bug = (what: string, err: unknown) =>
  `The ${what} could not be drawn (${err instanceof Error ? err.message : String(err)}). This is a bug in Loopwright; the counts and problems are still right.`;

function tokensOf(source: string): HighlightToken[] {
  try {
    return highlightTokens(source);
  } catch {
    return []; // colouring is a nicety; the compile below reports real problems
  }
}

const emptyHeader: CompiledView['header'] = {
  title: null, designer: null, item: null, sizes: [], construction: 'round', gauge: null, yarns: [], floatLimit: { value: 1, unit: 'in' },
};

/** Draws the chart the page asked for from the newest compile. */
async function drawChart(): Promise<void> {
  const want = settings.chart;
  const current = compiled;
  if (!want || !current) return;
  const { id, result } = current;
  const size = want.size && result.sizes.some((s) => s.name === want.size) ? want.size : result.sizes[0]?.name;
  const base = { type: 'chart' as const, id, size: size ?? '', side: want.side, cell: want.cell };
  let answer: ChartMessage;
  try {
    const { buildChart, renderChartSvg, renderBackSvg } = await loadRenderers();
    const model = size ? buildChart(result, size) : null;
    answer = !model || model.rows.length === 0
      ? { ...base, svg: null, problem: NOTHING_YET }
      : { ...base, svg: want.side === 'back' ? renderBackSvg(model, { cell: want.cell }) : renderChartSvg(model, { cell: want.cell }) };
  } catch (err) {
    answer = { ...base, svg: null, problem: bug('chart', err) };
  }
  post(answer);
}

/** Writes the instructions the page asked for from the newest compile. */
async function writeViews(): Promise<void> {
  const want = settings.instructions;
  const current = compiled;
  if (!want || !current) return;
  const { id, source, result } = current;
  const size = want.size && result.sizes.some((s) => s.name === want.size) ? want.size : result.sizes[0]?.name;
  const base = { type: 'instructions' as const, id, size: size ?? '' };
  let answer: InstructionsMessage;
  try {
    const { writeInstructions } = await loadRenderers();
    const ins = size ? writeInstructions(source, result, size) : null;
    answer = ins && ins.entries.length ? { ...base, instructions: ins } : { ...base, instructions: null, problem: NOTHING_YET };
  } catch (err) {
    answer = { ...base, instructions: null, problem: bug('instructions', err) };
  }
  post(answer);
}

function drawViews(): void {
  void drawChart();
  void writeViews();
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
    compiled = { id: msg.id, source: msg.source, result };
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
