import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, describe, expect, it } from "vitest";

// scripts/lib/common.sh's ensure_local_env, run by bash in a throw-away folder: the environment always
// wins over .env.local, which is read literally (never executed), and a secret (the session secret, the
// mail sink's token) is generated only when neither provides one.

const common = join(process.cwd(), "scripts/lib/common.sh");
const folders: string[] = [];
afterEach(() => folders.splice(0).forEach((folder) => rmSync(folder, { recursive: true, force: true })));

function run(envLocal: string | null, env: Record<string, string>, print: string[]) {
  const folder = mkdtempSync(join(tmpdir(), "bw-env-"));
  folders.push(folder);
  if (envLocal !== null) writeFileSync(join(folder, ".env.local"), envLocal);
  const script = `. "${common}"; ensure_local_env >/dev/null; ${print.map((name) => `printf '%s\\n' "$${name}"`).join("; ")}`;
  const output = execFileSync("bash", ["--norc", "--noprofile", "-c", script], { cwd: folder, env: { PATH: process.env.PATH ?? "", NODE_ENV: "test", ...env }, encoding: "utf8" });
  const file = safeRead(join(folder, ".env.local"));
  return { values: output.trimEnd().split("\n"), file };
}

function safeRead(path: string): string {
  try {
    return readFileSync(path, "utf8");
  } catch {
    return "";
  }
}

describe("ensure_local_env", () => {
  const given = "from-the-environment-0123456789abcdef";
  const sinkToken = "sink-token-from-the-environment-0123456789";

  it("keeps a BETTER_AUTH_SECRET, PORT and DATABASE_URL given in the environment", () => {
    const local = "BETTER_AUTH_SECRET=0123456789abcdef0123456789abcdef-local\nPORT=4000\nDATABASE_URL=postgres://a@127.0.0.1:1/x\n";
    const { values, file } = run(local, { BETTER_AUTH_SECRET: given, MAIL_SINK_TOKEN: sinkToken, PORT: "5000", DATABASE_URL: "postgres://b@127.0.0.1:2/y" }, [
      "BETTER_AUTH_SECRET",
      "PORT",
      "DATABASE_URL",
    ]);
    expect(values).toEqual([given, "5000", "postgres://b@127.0.0.1:2/y"]);
    expect(file).toBe(local);
  });

  it("generates no secret into .env.local when the environment has one", () => {
    const { values, file } = run(null, { BETTER_AUTH_SECRET: given, MAIL_SINK_TOKEN: sinkToken }, ["BETTER_AUTH_SECRET", "MAIL_SINK_TOKEN"]);
    expect(values).toEqual([given, sinkToken]);
    expect(file).toBe("");
  });

  it("generates a mail sink token once, kept across runs, and a different one from the session secret", () => {
    const first = run(null, {}, ["BETTER_AUTH_SECRET", "MAIL_SINK_TOKEN"]);
    const [secret, token] = first.values;
    expect(token).toMatch(/^[0-9a-f]{64}$/);
    expect(token).not.toBe(secret);
    expect(first.file).toBe(`BETTER_AUTH_SECRET=${secret}\nMAIL_SINK_TOKEN=${token}\n`);
    // Read again from the same file: nothing new is generated.
    const again = run(first.file, {}, ["MAIL_SINK_TOKEN"]);
    expect(again.values).toEqual([token]);
    expect(again.file).toBe(first.file);
  });

  it("fills unset variables from .env.local, read literally with quotes removed", () => {
    const local = 'MAIL_FROM=Bandwright <no-reply@bandwright.invalid>\nQUOTED="two words"\n# COMMENTED=1\nLAST=$(echo run)';
    const { values } = run(local, {}, ["MAIL_FROM", "QUOTED", "COMMENTED", "LAST"]);
    expect(values).toEqual(["Bandwright <no-reply@bandwright.invalid>", "two words", "", "$(echo run)"]);
  });

  it("treats an empty secret as missing and appends a new one on its own line", () => {
    const { values, file } = run("BETTER_AUTH_SECRET=\nPORT=4000", {}, ["BETTER_AUTH_SECRET", "PORT"]);
    expect(values[0]).toMatch(/^[0-9a-f]{64}$/);
    expect(values[1]).toBe("4000");
    expect(file.split("\n")).toContain("PORT=4000");
    expect(file.split("\n")).toContain(`BETTER_AUTH_SECRET=${values[0]}`);
  });
});
