export { formatQuantity, roundError, MINUS_SIGN } from "./quantity";
export type { QuantityFormatOptions, RoundedError } from "./quantity";
export { formatDate, formatDateTime } from "./date";
export { linkSegments } from "./link-segments";
export type { TextSegment } from "./link-segments";
