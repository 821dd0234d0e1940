import { type ChildProcess, spawn } from "node:child_process";

// Keeps a set of processes running: a child that exits is started again after a back-off that doubles
// with each quick failure (up to a cap) and starts over once the child has run healthily for a while.
// Services that run on their own (a daemon such as PostgreSQL, started by a command and found through its
// pid file) are checked periodically and started again the same way. Stopping sends SIGTERM to every
// child and waits for all of them.

/** A process the supervisor starts and owns. */
export type ChildSpec = { name: string; command: string; args: string[]; env?: NodeJS.ProcessEnv };

/** A daemon the supervisor only watches: `isRunning` is asked every check, `start` brings it back. */
export type ServiceSpec = { name: string; isRunning(): boolean; start(): Promise<void> };

/** Restart timing, milliseconds. */
export type BackOff = {
  /** delay before the first restart after a healthy run */
  initialMs: number;
  /** longest delay */
  maxMs: number;
  /** a run at least this long counts as healthy: the next failure starts from `initialMs` again */
  healthyAfterMs: number;
};

export const defaultBackOff: BackOff = { initialMs: 1000, maxMs: 30_000, healthyAfterMs: 60_000 };

/**
 * Delay before restart number `failures` in a row (1 = the first after a healthy run), milliseconds:
 * initial × 2^(failures − 1), at most `maxMs`.
 */
export function restartDelayMs(failures: number, backOff: Pick<BackOff, "initialMs" | "maxMs">): number {
  return Math.min(backOff.maxMs, backOff.initialMs * 2 ** Math.max(0, Math.min(failures - 1, 30)));
}

/** One line per event, with a timestamp. */
export type SupervisorLog = (message: string) => void;
export const consoleLog: SupervisorLog = (message) => console.log(`[supervisor ${new Date().toISOString()}] ${message}`);

type Tracked = { failures: number; timer?: NodeJS.Timeout };

export class Supervisor {
  private readonly running = new Map<string, { child: ChildProcess; startedAt: number }>();
  private readonly tracked = new Map<string, Tracked>();
  private serviceTimer?: NodeJS.Timeout;
  private stopping = false;

  constructor(
    private readonly options: {
      children: ChildSpec[];
      services?: ServiceSpec[];
      backOff?: BackOff;
      /** how often services are checked, ms (default 5 s) */
      serviceCheckMs?: number;
      /** how long stop() waits before SIGKILL, ms (default 30 s) */
      stopTimeoutMs?: number;
      log?: SupervisorLog;
    },
  ) {}

  private get backOff(): BackOff {
    return this.options.backOff ?? defaultBackOff;
  }

  private log(message: string): void {
    (this.options.log ?? consoleLog)(message);
  }

  private track(name: string): Tracked {
    let tracked = this.tracked.get(name);
    if (!tracked) this.tracked.set(name, (tracked = { failures: 0 }));
    return tracked;
  }

  /** Starts every child and the service checks. */
  start(): void {
    for (const spec of this.options.children) this.spawn(spec);
    const services = this.options.services ?? [];
    if (services.length) this.serviceTimer = setInterval(() => services.forEach((s) => this.checkService(s)), this.options.serviceCheckMs ?? 5000);
  }

  /** The pid of each running child, by name (for the tests and the log). */
  pids(): Record<string, number | undefined> {
    return Object.fromEntries([...this.running].map(([name, { child }]) => [name, child.pid]));
  }

  private spawn(spec: ChildSpec): void {
    const child = spawn(spec.command, spec.args, { env: spec.env ?? process.env, stdio: "inherit" });
    const startedAt = Date.now();
    this.running.set(spec.name, { child, startedAt });
    child.once("spawn", () => this.log(`${spec.name} started (pid ${child.pid})`));
    child.once("error", (error) => this.log(`${spec.name} could not be started: ${error.message}`));
    child.once("close", (code, signal) => {
      this.running.delete(spec.name);
      const ran = ((Date.now() - startedAt) / 1000).toFixed(1);
      const how = signal ? `signal ${signal}` : `code ${code}`;
      if (this.stopping) return this.log(`${spec.name} stopped (${how})`);
      const tracked = this.track(spec.name);
      tracked.failures = Date.now() - startedAt >= this.backOff.healthyAfterMs ? 1 : tracked.failures + 1;
      const delay = restartDelayMs(tracked.failures, this.backOff);
      this.log(`${spec.name} exited (${how}) after ${ran} s; restart ${tracked.failures} in ${(delay / 1000).toFixed(1)} s`);
      tracked.timer = setTimeout(() => {
        tracked.timer = undefined;
        if (!this.stopping) this.spawn(spec);
      }, delay);
    });
  }

  private checkService(service: ServiceSpec): void {
    const tracked = this.track(service.name);
    if (this.stopping || tracked.timer || service.isRunning()) return;
    tracked.failures += 1;
    const delay = tracked.failures === 1 ? 0 : restartDelayMs(tracked.failures - 1, this.backOff);
    this.log(`${service.name} is not running; starting it${delay ? ` in ${(delay / 1000).toFixed(1)} s` : ""} (try ${tracked.failures})`);
    tracked.timer = setTimeout(() => {
      service
        .start()
        .then(
          () => {
            tracked.failures = 0;
            this.log(`${service.name} started again`);
          },
          (error: unknown) => this.log(`${service.name} did not start: ${error instanceof Error ? error.message : String(error)}`),
        )
        .finally(() => (tracked.timer = undefined));
    }, delay);
  }

  /** Sends SIGTERM to every child (no more restarts) and resolves once all have exited. */
  async stop(signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
    if (this.stopping) return;
    this.stopping = true;
    clearInterval(this.serviceTimer);
    for (const tracked of this.tracked.values()) clearTimeout(tracked.timer);
    const children = [...this.running.values()].map((r) => r.child);
    this.log(`stopping: ${signal} to ${[...this.running.keys()].join(", ") || "no running child"}`);
    await Promise.all(
      children.map(
        (child) =>
          new Promise<void>((resolve) => {
            if (child.exitCode !== null || child.signalCode !== null) return resolve();
            const force = setTimeout(() => child.kill("SIGKILL"), this.options.stopTimeoutMs ?? 30_000);
            child.once("close", () => {
              clearTimeout(force);
              resolve();
            });
            child.kill(signal);
          }),
      ),
    );
    this.log("every child has stopped");
  }
}
