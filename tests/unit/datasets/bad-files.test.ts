import { describe, expect, it } from "vitest";
import { type DispersionParseResult, describeFileIssue, parseDispersionFile } from "@/lib/datasets";
import { longMapping } from "./helpers";

// The refusals listed in issue 7 ("What must be tested"), each with the row (line in the file, header and
// comments included) and column (1-based, with its header name) a user sees in an editor. The expected
// positions are read off the small files written here (common practice: line and column as editors count).

const refusedWith = (result: DispersionParseResult) => {
  if (result.ok) throw new Error("expected the file to be refused");
  return result;
};

const header = "kx,ky,band,E\n";

describe("refused files", () => {
  it("refuses an empty file", async () => {
    const r = refusedWith(await parseDispersionFile("", longMapping()));
    expect(r.issues).toEqual([{ row: null, column: null, columnName: null, message: expect.stringMatching(/empty/) }]);
  });

  it("refuses a file of comments and blank lines only", async () => {
    const r = refusedWith(await parseDispersionFile("# nothing here\n\n  \n", longMapping()));
    expect(r.issues[0].message).toMatch(/no header row/);
  });

  it("refuses a header with no data rows, naming the header's row", async () => {
    const r = refusedWith(await parseDispersionFile("# exported\n" + header, longMapping()));
    expect(r.issues[0]).toMatchObject({ row: 2, message: expect.stringMatching(/no data rows/) });
  });

  it("refuses a mapped column missing from the header", async () => {
    const r = refusedWith(await parseDispersionFile("kx,ky,band,energy\n0,0,1,2\n", longMapping()));
    expect(r.issues).toEqual([
      { row: 1, column: null, columnName: "E", message: expect.stringMatching(/mapped column “E” is not in the header/) },
    ]);
  });

  it("refuses non-numeric, NaN and Infinity values with row and column", async () => {
    const text = header + "0,0,1,-1.5\n0.1,0,1,abc\n0.2,NaN,1,1\n0.3,0,1,-Infinity\n0.4,0,1,\n";
    const r = refusedWith(await parseDispersionFile(text, longMapping()));
    expect(r.issues).toEqual([
      { row: 3, column: 4, columnName: "E", message: "“abc” is not a number" },
      { row: 4, column: 2, columnName: "ky", message: "“NaN” is not a finite number" },
      { row: 5, column: 4, columnName: "E", message: "“-Infinity” is not a finite number" },
      { row: 6, column: 4, columnName: "E", message: "empty value where a number is expected" },
    ]);
    expect(r.issueCount).toBe(4);
    expect(describeFileIssue(r.issues[0])).toBe("Row 3, column 4 (E): “abc” is not a number");
  });

  it("refuses a number too large for a double", async () => {
    const r = refusedWith(await parseDispersionFile(header + "0,0,1,1e999\n", longMapping()));
    expect(r.issues[0]).toMatchObject({ row: 2, column: 4, message: "“1e999” is too large" });
  });

  it("refuses ragged rows", async () => {
    const r = refusedWith(await parseDispersionFile(header + "0,0,1,1\n0.1,0,1\n0.2,0,1,1,9\n", longMapping()));
    expect(r.issues).toEqual([
      { row: 3, column: null, columnName: null, message: "this row has 3 fields, the header has 4" },
      { row: 4, column: null, columnName: null, message: "this row has 5 fields, the header has 4" },
    ]);
  });

  it("refuses the wrong delimiter: one column where the mapping needs several", async () => {
    const text = "kx;ky;band;E\n0;0;1;1\n";
    const r = refusedWith(await parseDispersionFile(text, longMapping({ delimiter: "\t" })));
    expect(r.issues[0]).toMatchObject({ row: 1, column: null });
    expect(r.issues[0].message).toMatch(/single column .* split on tab; the mapping needs 4 columns — is the delimiter right/);
  });

  it("refuses a file over the size limit without reading it all", async () => {
    const text = header + "0,0,1,1\n".repeat(200);
    const r = refusedWith(await parseDispersionFile(text, longMapping(), { maxBytes: 1024 }));
    expect(r.issues.at(-1)?.message).toBe("the file is larger than the limit of 1 024 bytes");
  });

  it("refuses a file over the point limit", async () => {
    const rows = Array.from({ length: 30 }, (_, i) => `${i / 10},0,1,${i}`).join("\n");
    const r = refusedWith(await parseDispersionFile(header + rows, longMapping(), { maxPoints: 25 }));
    expect(r.issues.at(-1)?.message).toBe("the file holds more than 25 points, the limit");
  });

  it("refuses binary garbage (a NUL byte) naming the row", async () => {
    const bytes = new TextEncoder().encode(header + "0,0,1,1\n0.1,0,1\u0000,2\n");
    const r = refusedWith(await parseDispersionFile(bytes, longMapping()));
    expect(r.issues.at(-1)).toMatchObject({ row: 3, message: expect.stringMatching(/NUL byte.*binary/) });
  });

  it("refuses invalid UTF-8", async () => {
    const bytes = new Uint8Array([...new TextEncoder().encode(header + "0,0,1,1\n"), 0xff, 0xfe, 0x31, 0x0a]);
    const r = refusedWith(await parseDispersionFile(bytes, longMapping()));
    expect(r.issues.at(-1)?.message).toMatch(/not valid UTF-8/);
  });

  it("refuses UTF-16 text with a hint to save as UTF-8", async () => {
    const utf16 = new Uint8Array([0xff, 0xfe, ...[...header].flatMap((c) => [c.charCodeAt(0), 0])]);
    const r = refusedWith(await parseDispersionFile(utf16, longMapping()));
    expect(r.issues.at(-1)?.message).toMatch(/UTF-16.*UTF-8/);
  });

  it("refuses band indices that are not positive integers", async () => {
    const r = refusedWith(await parseDispersionFile(header + "0,0,0,1\n0,0,1.5,1\n0,0,-2,1\n0,0,two,1\n", longMapping()));
    expect(r.issues.map((i) => [i.row, i.column, i.columnName])).toEqual([
      [2, 3, "band"],
      [3, 3, "band"],
      [4, 3, "band"],
      [5, 3, "band"],
    ]);
    expect(r.issues[1].message).toBe("band index “1.5” is not a positive integer (bands count from 1)");
  });

  it("refuses σ ≤ 0 and negative weights", async () => {
    const text = "kx,ky,band,E,dE,w\n0,0,1,1,0.01,1\n0,0,1,1,0,1\n0,0,1,1,-0.2,1\n0,0,1,1,0.1,-1\n";
    const mapping = longMapping({ sigma: { column: "dE" }, weight: { column: "w" } });
    const r = refusedWith(await parseDispersionFile(text, mapping));
    expect(r.issues).toEqual([
      { row: 3, column: 5, columnName: "dE", message: "σ must be positive, got 0" },
      { row: 4, column: 5, columnName: "dE", message: "σ must be positive, got -0.2" },
      { row: 5, column: 6, columnName: "w", message: "a weight cannot be negative, got -1" },
    ]);
  });

  it("refuses an unclosed quote, naming the row it opens on", async () => {
    const r = refusedWith(await parseDispersionFile(header + '0,0,1,1\n0,0,"1,1\n0,0,1,1\n', longMapping()));
    expect(r.issues.at(-1)).toMatchObject({ row: 3, message: expect.stringMatching(/never closed/) });
  });

  it("lists the first 50 problems and counts them all", async () => {
    const rows = Array.from({ length: 80 }, (_, i) => `${i},0,1,x${i}`).join("\n");
    const r = refusedWith(await parseDispersionFile(header + rows, longMapping()));
    expect(r.issues).toHaveLength(50);
    expect(r.issueCount).toBe(80);
    expect(r.issues[49]).toMatchObject({ row: 51, column: 4 });
  });

  it("refuses a path whose labelled points coincide", async () => {
    const mapping = longMapping({
      k: { kind: "path", column: "s", path: [
        { label: "Γ", k: [0, 0, 0], coordinates: "cartesian" },
        { label: "Γ", k: [0, 0, 0], coordinates: "cartesian" },
      ] },
    });
    const r = refusedWith(await parseDispersionFile("s,band,E\n0,1,1\n1,1,2\n", mapping));
    expect(r.issues[0].message).toMatch(/no length/);
  });
});
