import { execFile } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { parseArgs, promisify } from "node:util";
import { type ChildSpec, type ServiceSpec, Supervisor, defaultBackOff } from "./lib/supervisor";

// Runs the product's processes for `npm start` and keeps them running (scripts/lib/supervisor.ts): a child
// that exits is started again with back-off, every exit and restart is logged with a timestamp, and
// Ctrl-C / SIGTERM stops every child before this process exits (start.sh then stops PostgreSQL).
//
// Usage: tsx scripts/supervise.ts [--port N] [--postgres-data DIR --postgres-port N]
//          [--backoff-initial-ms N] [--backoff-max-ms N] [--healthy-after-ms N] <app|worker|mail-sink>...
// With --postgres-data it also watches the PostgreSQL server start.sh started there and starts it again
// when it stops. Children inherit this process's environment.

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: {
    port: { type: "string" },
    "postgres-data": { type: "string" },
    "postgres-port": { type: "string" },
    "backoff-initial-ms": { type: "string", default: String(defaultBackOff.initialMs) },
    "backoff-max-ms": { type: "string", default: String(defaultBackOff.maxMs) },
    "healthy-after-ms": { type: "string", default: String(defaultBackOff.healthyAfterMs) },
  },
});

function positiveInteger(name: string, value: string | undefined): number {
  const parsed = Number(value);
  if (!Number.isInteger(parsed) || parsed <= 0) throw new Error(`--${name} must be a positive integer (got ${value})`);
  return parsed;
}

// node itself runs each TypeScript file (not the tsx CLI, which would sit between us and the process).
const typescript = (file: string, ...args: string[]): Pick<ChildSpec, "command" | "args"> => ({
  command: process.execPath,
  args: ["--import", "tsx", file, ...args],
});

const known: Record<string, () => ChildSpec> = {
  app: () => ({
    name: "app",
    ...typescript("scripts/serve-app.ts", String(positiveInteger("port", values.port))),
    env: { ...process.env, NODE_ENV: "production" },
  }),
  worker: () => ({ name: "worker", ...typescript("workers/main.ts") }),
  "mail-sink": () => ({ name: "mail-sink", ...typescript("scripts/mail-sink.ts") }),
};

const unknown = positionals.filter((name) => !(name in known));
if (positionals.length === 0 || unknown.length) throw new Error(`usage: supervise.ts [options] <${Object.keys(known).join("|")}>... (unknown: ${unknown.join(", ")})`);

/** The PostgreSQL server in `data`: running while its postmaster.pid names a live process. */
function postgresService(data: string, port: number): ServiceSpec {
  const run = promisify(execFile);
  return {
    name: `PostgreSQL (${data})`,
    isRunning() {
      try {
        const pid = Number(readFileSync(join(data, "postmaster.pid"), "utf8").split("\n")[0]);
        process.kill(pid, 0);
        return true;
      } catch (error) {
        return (error as NodeJS.ErrnoException).code === "EPERM";
      }
    },
    // The same start as start.sh's (scripts/lib/common.sh: as the postgres user when root).
    start: async () => void (await run("bash", ["-c", '. scripts/lib/common.sh; start_postgres "$1" "$2"', "supervise", data, String(port)])),
  };
}

const postgresData = values["postgres-data"];
const supervisor = new Supervisor({
  children: positionals.map((name) => known[name]()),
  services: postgresData ? [postgresService(postgresData, positiveInteger("postgres-port", values["postgres-port"]))] : [],
  backOff: {
    initialMs: positiveInteger("backoff-initial-ms", values["backoff-initial-ms"]),
    maxMs: positiveInteger("backoff-max-ms", values["backoff-max-ms"]),
    healthyAfterMs: positiveInteger("healthy-after-ms", values["healthy-after-ms"]),
  },
});

for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => void supervisor.stop("SIGTERM").then(() => process.exit(0)));
supervisor.start();
