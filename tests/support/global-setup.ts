import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync } from "node:fs";
import type { TestProject } from "vitest/node";
import { freePort } from "./free-port";

// Starts the built app, the worker and the mail sink for the integration and browser projects, against
// the test database in DATABASE_URL (scripts/test.sh creates it). Tests read the addresses and the sink's
// per-run bearer token with inject("baseUrl"), inject("mailSinkUrl") and inject("mailSinkToken") from vitest
// (process.env.BASE_URL is Vite's base path inside test files). Both projects share one set of processes:
// the second project's setup reuses them.

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    mailSinkUrl: string;
    mailSinkToken: string;
  }
}

type Stack = { baseUrl: string; mailSinkUrl: string; mailSinkToken: string; children: ChildProcess[]; users: number };
const globalForStack = globalThis as typeof globalThis & { bandwrightTestStack?: Promise<Stack> };

function start(command: string, args: string[], env: NodeJS.ProcessEnv, label: string): ChildProcess {
  const child = spawn(command, args, { env, stdio: ["ignore", "pipe", "pipe"] });
  const relay = (chunk: Buffer) => {
    if (process.env.TEST_SERVER_LOGS === "1") process.stderr.write(`[${label}] ${chunk.toString()}`);
  };
  child.stdout?.on("data", relay);
  // Errors are always shown: a failing test is easier to read next to the server's stack trace.
  child.stderr?.on("data", (chunk: Buffer) => process.stderr.write(`[${label}] ${chunk.toString()}`));
  return child;
}

/** Rejects as soon as any child exits: a crashed worker or app fails the start at once, not after 90 s. */
function firstExit(children: { child: ChildProcess; label: string }[]): { promise: Promise<never>; cancel: () => void } {
  const listeners: (() => void)[] = [];
  const promise = new Promise<never>((_resolve, reject) => {
    for (const { child, label } of children) {
      const onExit = (code: number | null, signal: NodeJS.Signals | null) =>
        reject(new Error(`The test ${label} exited during start-up (code ${code}, signal ${signal}); its messages are above.`));
      child.once("exit", onExit);
      listeners.push(() => child.off("exit", onExit));
    }
  });
  return { promise, cancel: () => listeners.forEach((remove) => remove()) };
}

async function waitForHealth(baseUrl: string, timeoutMs: number, stopped: { done: boolean }): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = "no answer";
  while (Date.now() < deadline && !stopped.done) {
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) return;
      last = `${response.status} ${await response.text()}`;
    } catch (error) {
      last = String(error);
    }
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  if (stopped.done) return;
  throw new Error(`The test app at ${baseUrl} did not become healthy: ${last}`);
}

async function startStack(): Promise<Stack> {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL is not set; run the suites through `npm test`.");
  const distDir = process.env.NEXT_DIST_DIR ?? ".next";
  if (!existsSync(`${distDir}/BUILD_ID`)) throw new Error(`No production build in ${distDir}; run \`npm test\` (it builds first).`);
  const [appPort, smtpPort, sinkHttpPort] = [await freePort(), await freePort(), await freePort()];
  const baseUrl = `http://127.0.0.1:${appPort}`;
  const mailSinkUrl = `http://127.0.0.1:${sinkHttpPort}`;
  // A fresh token per run: the sink answers only requests that carry it (tests/support/mail.ts does).
  const mailSinkToken = randomBytes(32).toString("hex");
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    APP_URL: baseUrl,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    MAIL_SINK_URL: mailSinkUrl,
    MAIL_SINK_SMTP_PORT: String(smtpPort),
    MAIL_SINK_HTTP_PORT: String(sinkHttpPort),
    MAIL_SINK_TOKEN: mailSinkToken,
    // The tests connect from 127.0.0.1 and act as many clients through X-Forwarded-For (tests/support/
    // client.ts), so this one proxy is trusted here; production trusts none unless configured.
    TRUSTED_PROXIES: "127.0.0.1",
  };
  const labelled = [
    { label: "mail-sink", child: start("node_modules/.bin/tsx", ["scripts/mail-sink.ts"], env, "mail-sink") },
    { label: "worker", child: start("node_modules/.bin/tsx", ["workers/main.ts"], env, "worker") },
    { label: "app", child: start("node_modules/.bin/tsx", ["scripts/serve-app.ts", String(appPort)], env, "app") },
  ];
  const stack: Stack = { baseUrl, mailSinkUrl, mailSinkToken, children: labelled.map(({ child }) => child), users: 0 };
  const exited = firstExit(labelled);
  const stopped = { done: false };
  try {
    await Promise.race([waitForHealth(baseUrl, 90_000, stopped), exited.promise]);
    return stack;
  } catch (error) {
    // Never leave the app, worker or sink running after a failed start.
    await stopStack(stack);
    throw error;
  } finally {
    stopped.done = true;
    exited.cancel();
  }
}

async function stopStack(stack: Stack): Promise<void> {
  await Promise.all(
    stack.children.map(
      (child) =>
        new Promise<void>((resolve) => {
          if (child.exitCode !== null) return resolve();
          const force = setTimeout(() => child.kill("SIGKILL"), 10_000);
          child.once("exit", () => {
            clearTimeout(force);
            resolve();
          });
          child.kill("SIGTERM");
        }),
    ),
  );
}

export default async function setup(project: TestProject) {
  globalForStack.bandwrightTestStack ??= startStack();
  const stack = await globalForStack.bandwrightTestStack;
  stack.users += 1;
  project.provide("baseUrl", stack.baseUrl);
  project.provide("mailSinkUrl", stack.mailSinkUrl);
  project.provide("mailSinkToken", stack.mailSinkToken);
  return async () => {
    stack.users -= 1;
    if (stack.users === 0) {
      globalForStack.bandwrightTestStack = undefined;
      await stopStack(stack);
    }
  };
}
