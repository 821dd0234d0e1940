import { type ChildProcess, spawn } from "node:child_process";
import { afterAll, describe, expect, it } from "vitest";
import { freePort } from "@/tests/support/free-port";

// scripts/supervise.ts as `npm start` runs it, here with the real worker and mail sink on the test
// database and a short back-off: a SIGKILLed worker is started again, and SIGTERM stops every child.

let supervisor: ChildProcess | undefined;
let output = "";

afterAll(() => {
  if (supervisor && supervisor.exitCode === null) supervisor.kill("SIGKILL");
});

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function waitForOutput(pattern: RegExp, timeoutMs = 30_000): Promise<RegExpMatchArray> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = output.match(pattern);
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no ${pattern} in the supervisor's output:\n${output.slice(-3000)}`);
    await sleep(100);
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

describe("scripts/supervise.ts", () => {
  it("starts a SIGKILLed worker again after its back-off, and SIGTERM stops every child", async () => {
    const [smtpPort, httpPort] = [await freePort(), await freePort()];
    supervisor = spawn(
      process.execPath,
      ["--import", "tsx", "scripts/supervise.ts", "--backoff-initial-ms", "500", "--backoff-max-ms", "2000", "--healthy-after-ms", "60000", "worker", "mail-sink"],
      {
        env: { ...process.env, NODE_ENV: "production", WORKER_NAME: "supervised-worker", WORKER_FIT_CONCURRENCY: "1", MAIL_SINK_SMTP_PORT: String(smtpPort), MAIL_SINK_HTTP_PORT: String(httpPort) },
        stdio: ["ignore", "pipe", "pipe"],
      },
    );
    supervisor.stdout!.on("data", (chunk: Buffer) => (output += chunk.toString()));
    supervisor.stderr!.on("data", (chunk: Buffer) => (output += chunk.toString()));
    const exited = new Promise<number | null>((resolve) => supervisor!.once("exit", (code) => resolve(code)));

    const first = Number((await waitForOutput(/\[supervisor [^\]]+\] worker started \(pid (\d+)\)/))[1]);
    const sink = Number((await waitForOutput(/\[supervisor [^\]]+\] mail-sink started \(pid (\d+)\)/))[1]);
    await waitForOutput(/worker supervised-worker: listening/);
    process.kill(first, "SIGKILL");

    await waitForOutput(/\[supervisor \d{4}-\d\d-\d\dT[\d:.]+Z\] worker exited \(signal SIGKILL\) after \d+\.\d s; restart 1 in 0\.5 s/);
    const second = Number((await waitForOutput(/worker started \(pid (\d+)\)[\s\S]*worker started \(pid (\d+)\)/))[2]);
    expect(second).not.toBe(first);
    await waitForOutput(/listening[\s\S]*worker supervised-worker: listening/);
    expect(alive(second)).toBe(true);
    expect(alive(sink)).toBe(true);

    supervisor.kill("SIGTERM");
    expect(await exited).toBe(0);
    expect(output).toMatch(/stopping: SIGTERM to worker, mail-sink|stopping: SIGTERM to mail-sink, worker/);
    expect(output).toMatch(/worker stopped \(code 0\)/);
    expect(output).toMatch(/mail-sink stopped \(code 0\)/);
    expect(output).toMatch(/every child has stopped/);
    expect([second, sink].map(alive)).toEqual([false, false]);
  }, 90_000);
});
