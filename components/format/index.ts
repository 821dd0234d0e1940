export { formatQuantity, roundError, MINUS_SIGN } from "./quantity";
export type { QuantityFormatOptions, RoundedError } from "./quantity";
export { formatDate, formatDateTime } from "./date";
