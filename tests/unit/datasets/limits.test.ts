import { describe, expect, it } from "vitest";
import { type DispersionParseResult, datasetMappingSchema, parseDatasetMapping, parseDispersionFile } from "@/lib/datasets";
import { chunked, longMapping } from "./helpers";

// Issue 11, items 8 and 9: integers the int4 columns cannot hold, and lines or headers too large to split
// cheaply, are refused with row and column (lib/datasets/limits.ts) instead of being wrapped or split.
// 2³¹ − 1 = 2 147 483 647 is the largest int4 (PostgreSQL 15 manual, §8.1.1 "Integer Types").

const refusedWith = (result: DispersionParseResult) => {
  if (result.ok) throw new Error("expected the file to be refused");
  return result;
};
const accepted = (result: DispersionParseResult) => {
  if (!result.ok) throw new Error(`refused: ${JSON.stringify(result.issues)}`);
  return result;
};

const header = "kx,ky,band,E\n";

describe("band indices above the limit (100 000)", () => {
  it.each([
    ["2³¹ − 1", "2147483647"],
    ["2³¹", "2147483648"],
    ["2³² + 1", "4294967297"],
    ["the limit + 1", "100001"],
    ["2³² + 1 written with an exponent", "4.294967297e9"],
  ])("refuses %s in a long file's band column, with row and column", async (_, cell) => {
    const r = refusedWith(await parseDispersionFile(`${header}0,0,1,-1\n0.1,0,${cell},-1\n`, longMapping()));
    expect(r.issues).toEqual([
      {
        row: 3,
        column: 3,
        columnName: "band",
        message: `band index “${cell}” is above the limit of 100 000 (bands count from 1; is this the band column?)`,
      },
    ]);
  });

  it("accepts band 100 000 itself and stores it unchanged", async () => {
    const r = accepted(await parseDispersionFile(`${header}0,0,1,-1\n0.1,0,100000,2\n`, longMapping()));
    expect(r.points.map((p) => p.band)).toEqual([1, 100000]);
    expect(r.summary.bands).toEqual([1, 100000]);
  });

  it("refuses a wide mapping with more energy columns than a header may hold", () => {
    const columns = Array.from({ length: 10_000 }, (_, i) => `E${i + 1}`);
    const parsed = parseDatasetMapping({
      name: "too wide", source: "calculation", format: "wide",
      k: { kind: "cartesian", columns: ["kx"] }, energy: { columns, unit: "eV" },
    });
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.fieldErrors["energy.columns"]).toEqual(["at most 9 999 energy columns (a header holds at most 10 000 cells)"]);
  });

  it("reads a wide file whose band numbers are its column positions, up to the header's cell limit", async () => {
    const bands = 9_999;
    const names = Array.from({ length: bands }, (_, i) => `E${i + 1}`);
    const text = `kx,${names.join(",")}\n0,${names.map((_, i) => i / 1000).join(",")}\n`;
    const mapping = datasetMappingSchema.parse({
      name: "wide", source: "calculation", format: "wide",
      k: { kind: "cartesian", columns: ["kx"] }, energy: { columns: names, unit: "eV" },
    });
    const r = accepted(await parseDispersionFile(text, mapping));
    expect(r.summary.bandCount).toBe(bands);
    expect(r.points.at(-1)).toMatchObject({ band: bands, energy: (bands - 1) / 1000 });
  });
});

describe("headers and lines too long to read", () => {
  it("refuses a 20 MB header line before splitting it", async () => {
    // One line of 20 000 001 bytes ("kx,ky,band,E," then "c," ten million times), then a data row.
    const text = `kx,ky,band,E,${"c,".repeat(9_999_994)}\n0,0,1,1\n`;
    const r = refusedWith(await parseDispersionFile(text, longMapping()));
    expect(r.issues).toEqual([
      { row: 1, column: null, columnName: null, message: "this line is longer than the limit of 1 MiB (1 048 576 bytes) for one line" },
    ]);
  });

  it("refuses a header of more than 10 000 cells, within the line limit, naming the count", async () => {
    const names = Array.from({ length: 10_001 - 4 }, (_, i) => `x${i}`);
    const r = refusedWith(await parseDispersionFile(`kx,ky,band,E,${names.join(",")}\n0,0,1,1\n`, longMapping()));
    expect(r.issues).toEqual([
      { row: 1, column: null, columnName: null, message: "the header has 10 001 cells when split on comma, more than the limit of 10 000" },
    ]);
  });

  it("refuses an over-long header whichever delimiter detection would pick (whitespace)", async () => {
    const names = Array.from({ length: 12_000 }, (_, i) => `x${i}`);
    const r = refusedWith(await parseDispersionFile(`kx ky band E ${names.join(" ")}\n0 0 1 1\n`, longMapping()));
    expect(r.issues[0]).toMatchObject({ row: 1, message: "the header has 12 004 cells when split on whitespace, more than the limit of 10 000" });
  });

  it("refuses an over-long data line with its row", async () => {
    const long = "9".repeat(1024 * 1024);
    const r = refusedWith(await parseDispersionFile(`# comment\n${header}0,0,1,1\n0,0,1,${long}\n0,0,1,2\n`, longMapping()));
    expect(r.issues.at(-1)).toEqual({
      row: 4,
      column: null,
      columnName: null,
      message: "this line is longer than the limit of 1 MiB (1 048 576 bytes) for one line",
    });
  });

  it("calls a long run of bytes without a newline but with a NUL binary, not an over-long line", async () => {
    const bytes = new Uint8Array(2 * 1024 * 1024).fill(0x41);
    bytes[1000] = 0;
    const r = refusedWith(await parseDispersionFile(bytes, longMapping()));
    expect(r.issues.at(-1)).toMatchObject({ row: 1, message: expect.stringMatching(/NUL byte.*binary/) });
  });

  it("counts the limit in bytes of UTF-8, not in characters", async () => {
    // "é" is two bytes in UTF-8 (RFC 3629 §3: U+0080–U+07FF take two): 600 000 of them are 1 200 000 bytes.
    const mapping = longMapping({ label: { column: "cut" } });
    const line = (n: number) => `kx,ky,band,E,cut\n0,0,1,1,${"é".repeat(n)}\n`;
    const r = refusedWith(await parseDispersionFile(line(600_000), mapping));
    expect(r.issues.at(-1)).toMatchObject({ row: 2, message: expect.stringMatching(/longer than the limit of 1 MiB/) });
    expect(accepted(await parseDispersionFile(line(500_000), mapping)).points[0].label).toHaveLength(500_000);
  });

  it("refuses a quote left open across lines once the record passes the limit, naming the row it opens on", async () => {
    const rows = Array.from({ length: 120_000 }, (_, i) => `0,${i},1,1`).join("\n"); // about 1.3 MB
    const r = refusedWith(await parseDispersionFile(`${header}0,0,1,1\n0,0,"1,1\n${rows}\n`, longMapping()));
    expect(r.issues.at(-1)).toEqual({
      row: 3,
      column: null,
      columnName: null,
      message: "the quoted field opened on this row runs past the limit of 1 MiB (1 048 576 bytes) for one record: is a closing quote (\") missing?",
    });
  });
});

describe("yielding to the event loop", () => {
  it("awaits the pause between chunks and steps, so other work runs during a long parse", async () => {
    // 4 000 rows ≈ 60 kB: with 1 kB chunks the parse passes the pause many times.
    const text = header + Array.from({ length: 4000 }, (_, i) => `${i / 1000},0,1,${i}`).join("\n");
    const order: string[] = [];
    let pauses = 0;
    const pause = () => {
      pauses++;
      return new Promise<void>((resolve) => setImmediate(resolve));
    };
    setImmediate(() => order.push("other work"));
    const parsing = parseDispersionFile(chunked(new TextEncoder().encode(text), 1024), longMapping(), { pause }).then((r) => {
      order.push("parse done");
      return r;
    });
    expect(accepted(await parsing).points).toHaveLength(4000);
    expect(order).toEqual(["other work", "parse done"]);
    expect(pauses).toBeGreaterThan(3);
  });

  it("never yields without a pause (a parse in memory finishes within one task)", async () => {
    const order: string[] = [];
    setImmediate(() => order.push("other work"));
    await parseDispersionFile(`${header}0,0,1,1\n0.1,0,1,2\n`, longMapping());
    order.push("parse done");
    expect(order).toEqual(["parse done"]);
  });
});
