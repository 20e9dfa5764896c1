/**
 * Render worker of the review and knitting pages: compiles a saved
 * revision's source (kept for the next request, so switching sizes does not
 * compile again) and draws the front chart and written instructions of one
 * size, off the main thread. Saved sources do not change, so only the
 * newest request matters; older ones still answer and the page drops them.
 */
import { compile, type CompileResult } from '../../../shared';
import { buildChart } from '../../../shared/render/chart-model';
import { renderChartSvg } from '../../../shared/render/chart-svg';
import { writeInstructions } from '../../../shared/render/instructions';
import type { RenderAnswer, RenderRequest } from './render-protocol';

let cached: { source: string; result: CompileResult } | null = null;

function compiled(source: string): CompileResult {
  if (cached?.source !== source) cached = { source, result: compile(source) };
  return cached.result;
}

function render(req: RenderRequest): RenderAnswer {
  const result = compiled(req.source);
  const sizes = result.sizes.map((s) => s.name);
  const size = req.size && sizes.includes(req.size) ? req.size : sizes[0] ?? '';
  const model = result.sizes.find((s) => s.name === size);
  const base: RenderAnswer = {
    id: req.id, sizes, size, construction: result.header.construction,
    rounds: (model?.rounds ?? []).map((r) => ({ number: r.number, side: r.side, front: r.front, backing: r.backing, total: r.total })),
    svg: null, instructions: null,
  };
  if (!model || model.rounds.length === 0) return { ...base, problem: 'This revision has no rounds the compiler could work out.' };
  const chart = buildChart(result, size);
  const svg = chart && chart.rows.length ? renderChartSvg(chart, { cell: req.cell }) : null;
  const ins = req.instructions ? writeInstructions(req.source, result, size) : null;
  return { ...base, svg, instructions: ins, problem: svg ? undefined : 'There is no chart for this size.' };
}

self.onmessage = (e: MessageEvent<RenderRequest>) => {
  let answer: RenderAnswer;
  try {
    answer = render(e.data);
  } catch (err) {
    // compile and the renderers must not throw on user input; say so plainly if they do.
    answer = {
      id: e.data.id, sizes: [], size: e.data.size ?? '', construction: 'round', rounds: [], svg: null, instructions: null,
      problem: `The pattern could not be drawn (${err instanceof Error ? err.message : String(err)}). This is a bug in Loopwright.`,
    };
  }
  (self as unknown as Worker).postMessage(answer);
};
