import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { type ChildSpec, Supervisor, restartDelayMs } from "@/scripts/lib/supervisor";

// The supervisor of `npm start` (scripts/lib/supervisor.ts), with tiny node processes as children and a
// short back-off.

const backOff = { initialMs: 100, maxMs: 400, healthyAfterMs: 1000 };
const node = (name: string, script: string): ChildSpec => ({ name, command: process.execPath, args: ["-e", script] });
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function until(condition: () => boolean, timeoutMs = 5000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!condition()) {
    if (Date.now() > deadline) throw new Error("condition not met in time");
    await sleep(20);
  }
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

let supervisor: Supervisor | undefined;
let folder: string | undefined;
afterEach(async () => {
  await supervisor?.stop();
  supervisor = undefined;
  if (folder) rmSync(folder, { recursive: true, force: true });
  folder = undefined;
});

describe("restartDelayMs", () => {
  it("doubles from the initial delay up to the cap", () => {
    expect([1, 2, 3, 4, 5].map((n) => restartDelayMs(n, { initialMs: 1000, maxMs: 30_000 }))).toEqual([1000, 2000, 4000, 8000, 16_000]);
    expect(restartDelayMs(6, { initialMs: 1000, maxMs: 30_000 })).toBe(30_000);
    expect(restartDelayMs(1000, { initialMs: 1000, maxMs: 30_000 })).toBe(30_000);
  });
});

describe("Supervisor", () => {
  it("starts a child killed with SIGKILL again, logging the exit with its signal", async () => {
    const log: string[] = [];
    supervisor = new Supervisor({ children: [node("sleeper", "setInterval(() => {}, 1000)")], backOff, log: (line) => log.push(line) });
    supervisor.start();
    await until(() => log.some((l) => l.startsWith("sleeper started")));
    const first = supervisor.pids().sleeper!;
    process.kill(first, "SIGKILL");
    await until(() => log.filter((l) => l.startsWith("sleeper started")).length === 2);
    const second = supervisor.pids().sleeper!;
    expect(second).not.toBe(first);
    expect(alive(second)).toBe(true);
    expect(log).toEqual([
      `sleeper started (pid ${first})`,
      expect.stringMatching(/^sleeper exited \(signal SIGKILL\) after \d+\.\d s; restart 1 in 0\.1 s$/),
      `sleeper started (pid ${second})`,
    ]);
  });

  it("doubles the delay of quick failures up to the cap, and starts over after a healthy run", async () => {
    folder = mkdtempSync(join(tmpdir(), "supervisor-"));
    const counter = join(folder, "runs");
    // Runs 1–4 fail at once; run 5 runs 1.3 s (healthy: longer than 1 s), then fails; run 6 fails at once.
    const script = `const fs = require("fs"); const f = ${JSON.stringify(counter)};
      const run = (fs.existsSync(f) ? Number(fs.readFileSync(f, "utf8")) : 0) + 1; fs.writeFileSync(f, String(run));
      if (run === 5) setTimeout(() => process.exit(4), 1300); else process.exit(3);`;
    const log: string[] = [];
    supervisor = new Supervisor({ children: [node("flaky", script)], backOff, log: (line) => log.push(line) });
    supervisor.start();
    await until(() => log.filter((l) => l.startsWith("flaky exited")).length === 6, 10_000);
    const exits = log.filter((l) => l.startsWith("flaky exited")).map((l) => l.replace(/after \d+\.\d s/, "after …"));
    expect(exits).toEqual([
      "flaky exited (code 3) after …; restart 1 in 0.1 s",
      "flaky exited (code 3) after …; restart 2 in 0.2 s",
      "flaky exited (code 3) after …; restart 3 in 0.4 s",
      "flaky exited (code 3) after …; restart 4 in 0.4 s",
      "flaky exited (code 4) after …; restart 1 in 0.1 s",
      "flaky exited (code 3) after …; restart 2 in 0.2 s",
    ]);
    expect(readFileSync(counter, "utf8")).toMatch(/^[67]$/);
  }, 15_000);

  it("stop sends SIGTERM to every child, waits for all of them and restarts none", async () => {
    folder = mkdtempSync(join(tmpdir(), "supervisor-"));
    const graceful = (name: string) =>
      node(
        name,
        `const fs = require("fs"); const f = ${JSON.stringify(join(folder!, name))};
        process.on("SIGTERM", () => { fs.writeFileSync(f, "SIGTERM"); setTimeout(() => process.exit(0), 200); });
        fs.writeFileSync(f, "ready"); setInterval(() => {}, 1000);`,
      );
    const state = (name: string) => existsSync(join(folder!, name)) && readFileSync(join(folder!, name), "utf8");
    const log: string[] = [];
    const own = new Supervisor({ children: [graceful("app"), graceful("worker")], backOff, log: (line) => log.push(line) });
    own.start();
    await until(() => state("app") === "ready" && state("worker") === "ready");
    const pids = Object.values(own.pids()) as number[];
    await own.stop();
    expect(pids.map(alive)).toEqual([false, false]);
    expect(["app", "worker"].map(state)).toEqual(["SIGTERM", "SIGTERM"]);
    await sleep(300);
    expect(log.filter((l) => l.includes("started"))).toHaveLength(2);
    expect(log.slice(2)).toEqual(["stopping: SIGTERM to app, worker", expect.stringMatching(/^(app|worker) stopped \(code 0\)$/), expect.stringMatching(/^(app|worker) stopped \(code 0\)$/), "every child has stopped"]);
  });

  it("starts a watched service again when it stops, backing off while its start fails", async () => {
    let running = true;
    let failuresLeft = 1;
    const starts: number[] = [];
    const log: string[] = [];
    supervisor = new Supervisor({
      children: [],
      services: [
        {
          name: "PostgreSQL (test)",
          isRunning: () => running,
          start: async () => {
            starts.push(Date.now());
            if (failuresLeft-- > 0) throw new Error("port in use");
            running = true;
          },
        },
      ],
      backOff,
      serviceCheckMs: 20,
      log: (line) => log.push(line),
    });
    supervisor.start();
    await sleep(100);
    expect(starts).toHaveLength(0);
    running = false;
    await until(() => log.includes("PostgreSQL (test) started again"));
    expect(log).toEqual([
      "PostgreSQL (test) is not running; starting it (try 1)",
      "PostgreSQL (test) did not start: port in use",
      "PostgreSQL (test) is not running; starting it in 0.1 s (try 2)",
      "PostgreSQL (test) started again",
    ]);
    expect(starts[1] - starts[0]).toBeGreaterThanOrEqual(90);
  });
});
