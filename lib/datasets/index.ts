export {
  datasetMappingSchema,
  labelledKPointSchema,
  kMappingSchema,
  kKinds,
  parseDatasetMapping,
  type DatasetMapping,
  type DatasetMappingInput,
  type KKind,
  type LabelledKPoint,
  type MappingParseResult,
} from "./mapping";
export {
  parseDispersionFile,
  parseDispersionTable,
  type DispersionParseResult,
  type DispersionTableResult,
} from "./parseDispersionFile";
export type { ByteSource } from "./byteSource";
export { type DataPoint, type PointTable, tablePoints } from "./pointTable";
export { type AxisTick, COLLINEAR_TOLERANCE, CUT_GAP_FRACTION } from "./pathCoordinates";
export type { DatasetSummary } from "./summary";
export { type FileIssue, LISTED_ISSUE_LIMIT, describeFileIssue } from "./issues";
export { MAX_BAND_INDEX, MAX_HEADER_CELLS, MAX_LINE_BYTES } from "./limits";
export { type ParseOptions, DEFAULT_MAX_BYTES, DEFAULT_MAX_POINTS, describeByteLimit } from "./options";
export { type Delimiter, type DelimiterChoice, detectDelimiter, describeDelimiter } from "./delimiter";
export { kColumnsBasis, kColumnsToCartesian, labelledPointToCartesian } from "./kCoordinates";
export { type PathVertex, placePathVertices, interpolateAlongPath } from "./kPath";
export {
  type ColumnRole,
  type ColumnGuess,
  type ColumnRoleGuess,
  type SuggestedMapping,
  guessColumnRoles,
  guessEnergyUnit,
} from "./columnRoles";
export { type FilePreview, type PreviewOptions, previewDelimitedText } from "./preview";
