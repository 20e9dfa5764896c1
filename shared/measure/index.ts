/**
 * Loopwright measurement library: units and gauge, yarn weight, colour,
 * shaping arithmetic, yarn estimates and finished sizes. Pure functions, no
 * DOM, no Node APIs, no I/O. See README.md for inputs, outputs, invariants
 * and units.
 */
export {
  CM_PER_INCH,
  DEFAULT_FLOAT_LIMIT,
  GAUGE_BASIS_CM,
  convertLength,
  dualLength,
  floatLimitInStitches,
  formatGauge,
  formatLength,
  gaugeFromPerInch,
  gaugeProblems,
  isFloatWithinLimit,
  isPositiveFinite,
  lengthToRows,
  lengthToStitches,
  normalizeGauge,
  rowsToLength,
  stitchesToLength,
  toCm,
  toInches,
  tryNormalizeGauge,
} from './units';
export type {
  CountRounding,
  DualLength,
  FormatLengthOptions,
  Gauge,
  GaugeBasis,
  GaugeDeclaration,
  Length,
  LengthUnit,
  MeasureOutcome,
  MeasureProblem,
} from './units';

export {
  DEFAULT_ALIKE_THRESHOLD,
  VISIONS,
  colourDifference,
  colourDifferenceFor,
  coloursTooAlike,
  contrastRatio,
  findAlikeColours,
  parseYarnColour,
  simulateVision,
  suggestColourName,
  symbolInk,
} from './colour';
export type { AlikePair, ColourInput, SymbolInk, Vision, YarnColour } from './colour';

export { YARN_WEIGHTS, classifyStitchesPer4In, classifyYarnWeight, suggestYarnWeight } from './yarn-weight';
export type {
  YarnWeightCategory,
  YarnWeightClassification,
  YarnWeightMatch,
  YarnWeightNeighbour,
  YarnWeightNumber,
} from './yarn-weight';

export {
  K2TOG,
  M1,
  MAX_SHAPING_STITCHES,
  countSegments,
  formatSegments,
  ordinal,
  spaceShapingEvenly,
  spreadShapingOverLength,
} from './shaping';
export type {
  EvenShaping,
  ShapingInterval,
  ShapingLayout,
  ShapingOverLength,
  ShapingOverLengthRequest,
  ShapingSegment,
  ShapingStitch,
  SpaceEvenlyRequest,
} from './shaping';

export {
  DEFAULT_YARN_ALLOWANCE,
  LOOP_COURSE_CONSTANT,
  LOOP_WALE_CONSTANT,
  METRES_PER_YARD,
  calibrateFromSwatch,
  estimateYarn,
  modelStitchLength,
} from './yarn-estimate';
export type {
  EstimateYarnOptions,
  StitchLengthModel,
  SwatchMeasurement,
  YarnAmount,
  YarnEstimate,
  YarnUsage,
} from './yarn-estimate';

export {
  BODY_MEASUREMENTS,
  EASE_CATEGORIES,
  HAT_NEGATIVE_EASE,
  compareToBody,
  easeCategory,
  finishedSize,
  suitableWearers,
} from './sizing';
export type { BodyComparison, BodyItem, BodyMeasurement, EaseCategory, FinishedSize, Wearer } from './sizing';
