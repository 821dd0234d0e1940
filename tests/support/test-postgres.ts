import { execFile } from "node:child_process";
import { existsSync } from "node:fs";
import { join } from "node:path";
import { promisify } from "node:util";

const run = promisify(execFile);

/** Stops and starts the tests' own PostgreSQL server. */
export type TestPostgres = { stop(): Promise<void>; start(): Promise<void> };

/**
 * The private PostgreSQL that scripts/test.sh started for this run (`TEST_PG_CONTROL_DATA`, `_PORT`),
 * through the same shell functions (scripts/lib/common.sh: pg_ctl as the postgres user when root). Null
 * when the run uses another server (TEST_DATABASE_URL), or when DATABASE_URL does not point at that
 * server's port on 127.0.0.1 — a test never stops a server it does not own.
 */
export function testPostgres(): TestPostgres | null {
  const data = process.env.TEST_PG_CONTROL_DATA;
  const port = process.env.TEST_PG_CONTROL_PORT;
  if (!data || !port || !existsSync(join(data, "PG_VERSION"))) return null;
  const url = new URL(process.env.DATABASE_URL ?? "postgres://invalid");
  if (url.hostname !== "127.0.0.1" || url.port !== port) return null;
  const shell = (script: string) => run("bash", ["-c", `. scripts/lib/common.sh; ${script}`, "test-postgres", data, port]);
  return {
    stop: async () => void (await shell('find_postgres_bin; stop_postgres "$1"')),
    start: async () => void (await shell('start_postgres "$1" "$2"')),
  };
}
