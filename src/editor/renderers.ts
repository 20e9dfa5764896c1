/**
 * The renderers the compile worker draws views with, in one module so they
 * load as one chunk the first time the chart or instructions pane opens.
 * (Imported from their modules rather than shared/render's index, which
 * also carries the summary and planner the studio does not use yet.)
 */
export { buildChart } from '../../shared/render/chart-model';
export { renderChartSvg } from '../../shared/render/chart-svg';
export { renderBackSvg } from '../../shared/render/back-svg';
export { writeInstructions } from '../../shared/render/instructions';
