/**
 * The renderers the compile worker draws views with, in one module so they
 * load as one chunk the first time the chart or instructions pane opens.
 * The summary and planner run in their own worker (summary.worker.ts).
 * (Imported from their modules rather than shared/render's index, which
 * also carries text formatters the studio does not use.)
 */
export { buildChart } from '../../shared/render/chart-model';
export { renderChartSvg } from '../../shared/render/chart-svg';
export { renderBackSvg } from '../../shared/render/back-svg';
export { writeInstructions } from '../../shared/render/instructions';
