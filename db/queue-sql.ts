import { type SQLChunk, sql } from "drizzle-orm";
import type { Database } from "./client";

/** A Drizzle transaction of the one client. */
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

/**
 * What pg-boss accepts as its `db` option (its `Db` interface, structurally): running its statements
 * through this makes a job part of our own transaction, so a revision and its job commit together.
 */
export type QueueSql = { executeSql(text: string, values: unknown[]): Promise<{ rows: unknown[] }> };

// pg-boss's values as node-postgres (its own driver) would send them: undefined as NULL (postgres.js
// refuses undefined) and objects as JSON (Drizzle's postgres.js client passes jsonb values through as
// they are).
function asParameter(value: unknown): unknown {
  if (value === undefined) return null;
  return value !== null && typeof value === "object" && !(value instanceof Date) && !Array.isArray(value) ? JSON.stringify(value) : value;
}

/**
 * pg-boss's statements (numbered `$n` placeholders, nothing else spelled with `$`) run inside `tx`:
 * each placeholder becomes a bound Drizzle parameter.
 */
export function queueSqlIn(tx: Transaction): QueueSql {
  return {
    async executeSql(text, values = []) {
      const chunks: SQLChunk[] = [];
      let last = 0;
      for (const match of text.matchAll(/\$(\d+)/g)) {
        chunks.push(sql.raw(text.slice(last, match.index)), sql.param(asParameter(values[Number(match[1]) - 1])));
        last = match.index + match[0].length;
      }
      chunks.push(sql.raw(text.slice(last)));
      const rows = await tx.execute(sql.join(chunks));
      return { rows: [...rows] };
    },
  };
}
