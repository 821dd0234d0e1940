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
export { parseDispersionFile, type DispersionParseResult } from "./parseDispersionFile";
export type { ByteSource } from "./byteSource";
export type { DataPoint, AxisTick } from "./points";
export type { DatasetSummary } from "./summary";
export { type FileIssue, LISTED_ISSUE_LIMIT, describeFileIssue } from "./issues";
export { type ParseOptions, DEFAULT_MAX_BYTES, DEFAULT_MAX_POINTS, describeByteLimit } from "./options";
export { type Delimiter, type DelimiterChoice, detectDelimiter, describeDelimiter } from "./delimiter";
export { kColumnsToCartesian, labelledPointToCartesian } from "./kCoordinates";
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
