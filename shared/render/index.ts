/**
 * Renderers of the compiled model (see README.md): the chart model and its
 * SVG (front and back of the work), written instructions, the summary and
 * the backing-stitch planner. Pure functions: no DOM, no Node APIs, no I/O.
 */
export { buildChart, floatLimitFromHeader } from './chart-model';
export type { ChartCell, ChartFloat, ChartMarker, ChartModel, ChartOptions, ChartRow, LegendEntry } from './chart-model';
export { renderChartSvg } from './chart-svg';
export { renderBackSvg } from './back-svg';
export type { ChartDrawOptions } from './chart-frame';
export { SYMBOLS, symbolDef, symbolFor, rightSideName } from './symbols';
export type { SymbolDef, SymbolId } from './symbols';
export { layoutColumns } from './columns';
export type { BoundOff, ColumnLayout } from './columns';
export { roundFloats, longestByYarn } from './float-lines';
export type { FloatLine, FloatPiece } from './float-lines';
export { escapeXml } from './svg';
export { writeInstructions, formatInstructionsText, formatCounts } from './instructions';
export type { InstructionEntry, Instructions, StitchCounts } from './instructions';
export type { KeyEntry } from './phrases';
export { summarize } from './summary';
export type { FloatReportEntry, PatternSummary, SizeSummary, SummaryOptions } from './summary';
export { formatSummaryText } from './summary-text';
export { planBacking, formatPlanText, floatRuns, stabIntervals, coverCircle } from './planner';
export type { PlanRequest, PlanResult, SizePlan } from './planner';
