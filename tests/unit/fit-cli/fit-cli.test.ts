// The fit command line: a small file gives one JSON line on stdout; bad input gives one line and exit 2.
// Data: the t–t′–t″ band E = −2t(cos k_x a + cos k_y a) − 4t′ cos k_x a cos k_y a − 2t″(cos 2k_x a + cos 2k_y a)
// (the square-single template's closed form) at t = 0.40, t′ = −0.12, t″ = 0.06 eV (from memory; cf. Pavarini et al., PRL 87, 047003 (2001)).
import { execFile } from "node:child_process";
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { beforeAll, describe, expect, it } from "vitest";

const run = promisify(execFile);
const A = 3.85;
let folder = "";

async function fit(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run("npx", ["tsx", "scripts/fit-cli.ts", ...args], { cwd: process.cwd() });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

beforeAll(async () => {
  folder = await mkdtemp(join(tmpdir(), "bandwright-fit-cli-"));
  const rows = ["kx,ky,kz,band,energy,sigma"];
  for (let i = 0; i < 40; i++) {
    const kx = ((Math.PI / A) * i) / 39;
    const ky = ((Math.PI / A) * ((i * 7) % 39)) / 39;
    const c = (x: number) => Math.cos(x * A);
    const e = -2 * 0.4 * (c(kx) + c(ky)) - 4 * -0.12 * c(kx) * c(ky) - 2 * 0.06 * (Math.cos(2 * kx * A) + Math.cos(2 * ky * A));
    rows.push(`${kx},${ky},0,1,${e},0.01`);
  }
  await writeFile(join(folder, "points.csv"), rows.join("\n"));
  await writeFile(join(folder, "model.json"), JSON.stringify({ template: "square-single", parameters: { t: { value: 0.33 } } }));
  await writeFile(join(folder, "bad-model.json"), JSON.stringify({ template: "square-single", parameters: { q: { value: 1 } } }));
}, 30_000);

describe("npm run fit", () => {
  it("prints the result as one JSON object on the last stdout line", async () => {
    const { code, stdout, stderr } = await fit(["--points", join(folder, "points.csv"), "--model", join(folder, "model.json")]);
    expect(code).toBe(0);
    expect(stderr).toMatch(/iteration 1: χ²/);
    const last = JSON.parse(stdout.trim().split("\n").at(-1)!);
    expect(last.parameters.t.value).toBeCloseTo(0.4, 8);
    expect(last.parameters["t'"].value).toBeCloseTo(-0.12, 8);
    expect(last.rms).toBeLessThan(1e-8);
    expect(last.bands).toEqual([expect.objectContaining({ dataBand: 1, points: 40 })]);
    expect(last.stopReason).toMatch(/tolerance/);
    expect(typeof last.iterations).toBe("number");
    expect(last.fitMs).toBeGreaterThan(0);
  }, 60_000);

  it.each([
    ["a missing file", ["--points", "/nonexistent/points.csv", "--model", "MODEL"], /no such file/],
    ["an unknown template parameter", ["--points", "POINTS", "--model", "BAD"], /has no parameter "q"/],
    ["a missing argument", ["--points", "POINTS"], /--model are required/],
  ])("refuses %s with one line and exit code 2", async (_, args, message) => {
    const resolved = args.map((a) => (a === "MODEL" ? join(folder, "model.json") : a === "BAD" ? join(folder, "bad-model.json") : a === "POINTS" ? join(folder, "points.csv") : a));
    const { code, stdout, stderr } = await fit(resolved);
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expect(stderr.trim().split("\n")).toHaveLength(1);
    expect(stderr).toMatch(message);
  }, 60_000);
});
