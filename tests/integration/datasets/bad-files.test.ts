import { beforeAll, describe, expect, it } from "vitest";
import { createRandom } from "@/lib/linalg";
import { createUploadTeam, storedRows, upload, type Refusal, type UploadTeam } from "./helpers";

// Issue 7 "What must be tested": every kind of bad file through the route against the real database is
// refused with a 4xx naming row and column, and stores nothing. Rows are the lines an editor shows
// (header = line 1); columns are 1-based (lib/datasets/issues.ts).

const mapping = {
  name: "bad file",
  source: "calculation",
  format: "long",
  k: { kind: "cartesian", columns: ["kx"] },
  band: { column: "band" },
  energy: { column: "E", unit: "eV" },
  sigma: { column: "dE" },
} as const;
const header = "kx,band,E,dE";
const good = ["0.0,1,-1.5,0.01", "0.1,1,-1.4,0.01", "0.2,1,-1.2,0.01"];
const file = (...rows: string[]) => `${[header, ...rows].join("\n")}\n`;

let team: UploadTeam;
beforeAll(async () => {
  team = await createUploadTeam("Refusals Lab");
});

async function expectRefused(bytes: Uint8Array | string, where: { row: number | null; column: number | null }, body: unknown = mapping) {
  const before = await storedRows(team);
  const response = await upload(team, { name: "bad.csv", bytes }, body);
  expect(response.status).toBe(422);
  const refusal = response.body as Refusal;
  expect(refusal.error.code).toBe("validation_failed");
  expect(refusal.error.issueCount).toBeGreaterThanOrEqual(refusal.error.issues.length);
  expect(refusal.error.issues).toContainEqual(expect.objectContaining({ row: where.row, column: where.column, message: expect.any(String) }));
  expect(await storedRows(team)).toEqual(before);
  return refusal;
}

describe("bad files through POST /api/workspaces/{slug}/datasets", () => {
  it("refuses an empty file", async () => {
    const refusal = await expectRefused("", { row: null, column: null });
    expect(refusal.error.issues[0].message).toMatch(/empty/);
  });

  it("refuses a file with a header and no rows", async () => {
    await expectRefused(file(), { row: 1, column: null });
  });

  it("refuses a file missing a mapped column, naming the column", async () => {
    const refusal = await expectRefused("kx,band,energy,dE\n0,1,-1,0.01\n", { row: 1, column: null });
    expect(refusal.error.issues[0].message).toContain("E");
  });

  it.each([
    ["a word", "abc"],
    ["NaN", "NaN"],
    ["Infinity", "Infinity"],
    ["a decimal comma", "-1,5"],
  ])("refuses %s as an energy, at its row and column", async (_, value) => {
    const refusal = await expectRefused(file(good[0], `0.3,1,"${value}",0.01`, good[1]), { row: 3, column: 3 });
    expect(refusal.error.issues.find((i) => i.row === 3)?.columnName).toBe("E");
  });

  it("refuses a ragged row", async () => {
    await expectRefused(file(good[0], "0.3,1", good[1]), { row: 3, column: null });
  });

  it("refuses the wrong delimiter: a semicolon file read as comma-separated", async () => {
    const semicolons = `${header.replaceAll(",", ";")}\n${good.map((r) => r.replaceAll(",", ";")).join("\n")}\n`;
    await expectRefused(semicolons, { row: 1, column: null }, { ...mapping, delimiter: "," });
  });

  it("refuses a file over the size limit (25 MiB default)", async () => {
    const row = "0.123456789,1,-1.23456789,0.01\n";
    const big = file() + row.repeat(Math.ceil((25 * 1024 * 1024 + 1024) / row.length));
    const refusal = await expectRefused(big, { row: null, column: null });
    expect(refusal.error.issues[0].message).toMatch(/limit of 25 MiB/);
  });

  it("refuses more points than the limit (500 000 default)", async () => {
    const rows = Array.from({ length: 500_001 }, (_, i) => `${(i * 1e-6).toFixed(6)},1,-1,0.01`);
    const refusal = await expectRefused(`${header}\n${rows.join("\n")}\n`, { row: expect.any(Number) as unknown as number, column: null });
    expect(refusal.error.issues.at(-1)?.message).toMatch(/500,000 points/);
  });

  it("refuses binary garbage", async () => {
    const random = createRandom(7);
    const bytes = Uint8Array.from({ length: 4096 }, () => Math.floor(random.uniform() * 256));
    bytes[10] = 0;
    await expectRefused(bytes, { row: expect.any(Number) as unknown as number, column: null });
  });

  it.each(["0", "1.5", "-2", "x"])("refuses the band index %s (not a positive integer)", async (band) => {
    await expectRefused(file(good[0], `0.3,${band},-1.1,0.01`), { row: 3, column: 2 });
  });

  it.each(["0", "-0.01"])("refuses σ = %s (σ must be > 0)", async (sigma) => {
    await expectRefused(file(good[0], `0.3,1,-1.1,${sigma}`), { row: 3, column: 4 });
  });

  it("refuses a path-distance mapping without the path, naming the field", async () => {
    const before = await storedRows(team);
    const response = await upload(team, { name: "path.csv", bytes: "d,band,E\n0,1,-1\n0.5,1,-0.5\n" }, {
      ...mapping,
      sigma: undefined,
      k: { kind: "path", column: "d" },
    });
    expect(response.status).toBe(422);
    expect((response.body as Refusal).error.fieldErrors?.["k.path"]?.[0]).toMatch(/labelled points/);
    expect(await storedRows(team)).toEqual(before);
  });

  it("refuses a mapping that is not JSON, and a request that is not multipart", async () => {
    const response = await upload(team, { name: "a.csv", bytes: file(...good) }, "{not json");
    expect(response.status).toBe(422);
    expect((response.body as Refusal).error.fieldErrors?.mapping).toBeDefined();
    const json = await team.editor.post(`/api/workspaces/${team.slug}/datasets`, { file: "x" });
    expect(json.status).toBe(400);
    expect(await storedRows(team)).toEqual({ datasets: 0, points: 0 });
  });

  it("lists at most 50 issues of a file with many bad rows, and counts them all", async () => {
    const rows = Array.from({ length: 80 }, (_, i) => `0.${i},1,bad,0.01`);
    const refusal = await expectRefused(file(...rows), { row: 2, column: 3 });
    expect(refusal.error.issues).toHaveLength(50);
    expect(refusal.error.issueCount).toBe(80);
  });
});
