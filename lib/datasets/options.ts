import { groupDigits } from "./limits";

/** Limits of one parse (refusals with a clear message, never silent truncation), and how it yields. */
export interface ParseOptions {
  /** Largest accepted file in bytes. Default {@link DEFAULT_MAX_BYTES} (25 MiB). */
  maxBytes?: number;
  /** Largest accepted number of points (energies) in the file. Default {@link DEFAULT_MAX_POINTS}. */
  maxPoints?: number;
  /**
   * Awaited after each chunk (at most 64 KiB) and between the steps that follow the reading, so that a
   * server answers other requests during a long parse (the upload passes one that waits for setImmediate).
   * Default: none (the parse of a file in memory then runs within one task).
   */
  pause?: () => Promise<void>;
}

/** 25 MiB = 26 214 400 bytes. */
export const DEFAULT_MAX_BYTES = 25 * 1024 * 1024;
/** 500 000 points. */
export const DEFAULT_MAX_POINTS = 500_000;

export type ResolvedParseOptions = Required<ParseOptions>;

const noPause = async (): Promise<void> => {};

/** Fills in the defaults once; rejects limits that are not positive integers. */
export function resolveParseOptions(options: ParseOptions = {}): ResolvedParseOptions {
  const limits = {
    maxBytes: options.maxBytes ?? DEFAULT_MAX_BYTES,
    maxPoints: options.maxPoints ?? DEFAULT_MAX_POINTS,
  };
  for (const [name, value] of Object.entries(limits))
    if (!Number.isInteger(value) || value <= 0) throw new RangeError(`${name} must be a positive integer, got ${value}`);
  return { ...limits, pause: options.pause ?? noPause };
}

/**
 * The byte limit as a user reads it: "25 MiB (26 214 400 bytes)", or "1 024 bytes" below 1 MiB.
 * @param bytes - a size in bytes
 */
export function describeByteLimit(bytes: number): string {
  const grouped = `${groupDigits(bytes)} bytes`;
  const mib = bytes / (1024 * 1024);
  if (mib < 1) return grouped;
  return `${Number.isInteger(mib) ? mib : mib.toFixed(1)} MiB (${grouped})`;
}
