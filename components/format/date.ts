/**
 * Dates shown in tables and headers. Always UTC with an explicit "UTC" suffix, so the server-rendered
 * text and the browser's hydrated text agree and teammates in different time zones read the same value.
 */
const dateTimeFormat = new Intl.DateTimeFormat("en-GB", {
  year: "numeric",
  month: "short",
  day: "2-digit",
  hour: "2-digit",
  minute: "2-digit",
  hourCycle: "h23",
  timeZone: "UTC",
});

const dateFormat = new Intl.DateTimeFormat("en-GB", {
  year: "numeric",
  month: "short",
  day: "2-digit",
  timeZone: "UTC",
});

function toDate(value: Date | string | number): Date {
  const date = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(date.getTime())) throw new RangeError(`not a valid date: ${String(value)}`);
  return date;
}

/**
 * Formats an instant as e.g. `03 Mar 2025, 14:07 UTC`.
 * @param value - a Date, an ISO 8601 string or milliseconds since the Unix epoch
 */
export function formatDateTime(value: Date | string | number): string {
  return `${dateTimeFormat.format(toDate(value))} UTC`;
}

/**
 * Formats the calendar day of an instant in UTC, e.g. `03 Mar 2025`.
 * @param value - a Date, an ISO 8601 string or milliseconds since the Unix epoch
 */
export function formatDate(value: Date | string | number): string {
  return dateFormat.format(toDate(value));
}
