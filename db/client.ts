import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Database = PostgresJsDatabase<typeof schema>;

type Connection = { sql: postgres.Sql; db: Database };

// One connection pool per process. Next's development server re-evaluates modules on every change, so the
// pool is kept on globalThis instead of being re-created each time.
const globalForDb = globalThis as typeof globalThis & { bandwrightDb?: Connection };

function connect(): Connection {
  const sql = postgres(env.DATABASE_URL, { max: 10, onnotice: () => {} });
  return { sql, db: drizzle(sql, { schema }) };
}

const connection = globalForDb.bandwrightDb ?? connect();
if (env.NODE_ENV !== "production") globalForDb.bandwrightDb = connection;

/** The Drizzle client; every query in db/queries uses it. */
export const db: Database = connection.db;

/** Closes the pool (scripts and the worker call this on exit). */
export async function closeDatabase(): Promise<void> {
  await connection.sql.end({ timeout: 5 });
}

export { schema };
