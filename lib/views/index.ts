export { type PathTick, displayLabel, pathTicks, tickLabeller } from "./ticks";
export { type BandStyle, UNMAPPED_BAND_COLOUR, dataBandStyles, modelBandStyles } from "./band-colours";
export { type BandPair, bandPairs } from "./band-mapping";
export {
  type ChartDataPoint,
  type ChartPoint,
  type DataBandSeries,
  type ModelBandLine,
  type PathKPoint,
  dataSeriesByBand,
  distinctKPoints,
  energyDomain,
  modelBandLines,
  modelEnergiesByKIndex,
  niceStep,
  type ChartResidual,
  chartResiduals,
} from "./band-series";
export {
  type BandComparisonRow,
  type ComparedBand,
  type ComparedParameter,
  type ParameterComparisonRow,
  compareBands,
  compareParameters,
} from "./compare";
export { type CorrelationCell, STRONG_CORRELATION, correlationCells, correlationFill } from "./heatmap";
export { type TracePoint, convergenceSeries } from "./convergence";
export {
  type ResidualQuery,
  type ResidualSortColumn,
  pageCount,
  residualQuerySchema,
  residualSearchParams,
  residualSortColumns,
  sortFromTable,
} from "./residual-query";
export { parameterLabel } from "./parameter-label";
export { FieldErrors, type NumberReading, readNumber } from "./number-field";
export {
  type DraftReading,
  type LaunchDraft,
  type LaunchRequest,
  type ModelSourceDraft,
  type ParameterDraft,
  draftFromRevision,
  launchRequestSchema,
  parameterDrafts,
  readLaunchDraft,
} from "./launch-draft";
