import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { datasetMappingSchema, parseDispersionFile } from "@/lib/datasets";
import { chunked } from "./helpers";

// Property-based tests (issue 7, "What must be tested"): random valid files round-trip to the points they
// were written from; random corruptions are refused at the right row and never throw. Seeded, so a failure
// replays. Numbers are written with String(x), which round-trips doubles exactly (ECMA-262 Number::toString).

const SEED = 20240607;
const RUNS = 150;

interface Row { kx: number; ky: number; band: number; energy: number; sigma: number; label: string }

const finite = (min: number, max: number) =>
  fc.double({ min, max, noNaN: true, noDefaultInfinity: true }).map((x) => (x === 0 ? 0 : x)); // fold −0 into 0
const rowArb = (labels: string[]) =>
  fc.record({
    kx: finite(-5, 5),
    ky: finite(-5, 5),
    band: fc.integer({ min: 1, max: 6 }),
    energy: finite(-20, 20),
    sigma: finite(1e-4, 1),
    label: fc.constantFrom(...labels),
  });

const layoutArb = fc.record({
  delimiter: fc.constantFrom(",", "\t", ";", "whitespace"),
  explicit: fc.boolean(),
  eol: fc.constantFrom("\n", "\r\n"),
  bom: fc.boolean(),
  quote: fc.boolean(),
  chunkSize: fc.integer({ min: 1, max: 97 }),
});

interface Layout { delimiter: string; explicit: boolean; eol: string; bom: boolean; quote: boolean; chunkSize: number }
interface FileCase { layout: Layout; rows: Row[]; comments: boolean[] }

const fileArb: fc.Arbitrary<FileCase> = layoutArb.chain((layout) => {
  const quoting = layout.quote && layout.delimiter !== "whitespace";
  const labels = quoting ? ["A", "Γ–X", 'cut "7"; east, 2'] : ["A", "B", "Γ–X"];
  return fc.record({
    layout: fc.constant(layout),
    rows: fc.array(rowArb(labels), { minLength: 1, maxLength: 25 }),
    comments: fc.array(fc.boolean(), { minLength: 26, maxLength: 26 }),
  });
});

const header = ["kx", "ky", "band", "E", "dE", "label"];
const mappingFor = (delimiter: string, explicit: boolean) =>
  datasetMappingSchema.parse({
    name: "random", source: "photoemission", format: "long",
    delimiter: explicit ? delimiter : "auto",
    k: { kind: "cartesian", columns: ["kx", "ky"] },
    band: { column: "band" }, energy: { column: "E", unit: "eV" },
    sigma: { column: "dE" }, label: { column: "label" },
  });

/** Writes the file's lines and remembers the line number (1-based) of each data row. */
function writeFile(f: FileCase) {
  const { delimiter, quote } = f.layout;
  const sep = delimiter === "whitespace" ? "  " : delimiter;
  const cell = (text: string) => (quote && delimiter !== "whitespace" ? `"${text.replace(/"/g, '""')}"` : text);
  const cells = (r: Row) => [r.kx, r.ky, r.band, r.energy, r.sigma].map(String).concat(r.label);
  const lines = ["# written by the property test", header.map(cell).join(sep)];
  const dataLines: number[] = [];
  f.rows.forEach((r, i) => {
    if (f.comments[i]) lines.push(i % 2 ? "# a comment" : "");
    lines.push(cells(r).map(cell).join(sep));
    dataLines.push(lines.length);
  });
  return { lines, dataLines, cells, sep };
}

const toBytes = (lines: string[], eol: string, bom: boolean) =>
  new TextEncoder().encode((bom ? "\uFEFF" : "") + lines.join(eol) + eol);

describe("parser properties", () => {
  it("round-trips random valid files to the same points", async () => {
    await fc.assert(
      fc.asyncProperty(fileArb, async (f) => {
        const { lines } = writeFile(f);
        const bytes = toBytes(lines, f.layout.eol, f.layout.bom);
        const r = await parseDispersionFile(chunked(bytes, f.layout.chunkSize), mappingFor(f.layout.delimiter, f.layout.explicit));
        if (!r.ok) throw new Error(JSON.stringify(r.issues.slice(0, 3)));
        expect(r.points.map((p) => ({ kx: p.k[0], ky: p.k[1], kz: p.k[2], band: p.band, energy: p.energy, sigma: p.sigma, label: p.label })))
          .toEqual(f.rows.map((row) => ({ kx: row.kx, ky: row.ky, kz: 0, band: row.band, energy: row.energy, sigma: row.sigma, label: row.label })));
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });

  const corruptions = [
    { name: "text in a number", column: 3, value: "abc" },
    { name: "NaN", column: 0, value: "NaN" },
    { name: "Infinity", column: 1, value: "Infinity" },
    { name: "band 0", column: 2, value: "0" },
    { name: "fractional band", column: 2, value: "2.5" },
    { name: "σ = 0", column: 4, value: "0" },
    { name: "negative σ", column: 4, value: "-0.1" },
    { name: "missing field", column: 3, value: null },
  ] as const;

  it("refuses random corruptions at the corrupted row, without throwing", async () => {
    await fc.assert(
      fc.asyncProperty(
        fileArb,
        fc.constantFrom(...corruptions),
        fc.nat(),
        async (f, corruption, which) => {
          const { lines, dataLines, cells, sep } = writeFile(f);
          const i = which % f.rows.length;
          const fields = cells(f.rows[i]);
          if (corruption.value === null) fields.splice(corruption.column, 1);
          else fields[corruption.column] = corruption.value;
          lines[dataLines[i] - 1] = fields.join(sep);
          const r = await parseDispersionFile(
            chunked(toBytes(lines, f.layout.eol, f.layout.bom), f.layout.chunkSize),
            mappingFor(f.layout.delimiter, true),
          );
          expect(r.ok).toBe(false);
          if (!r.ok) expect(r.issues.some((issue) => issue.row === dataLines[i])).toBe(true);
        },
      ),
      { seed: SEED, numRuns: RUNS },
    );
  });

  it("refuses binary bytes spliced in anywhere, without throwing", async () => {
    await fc.assert(
      fc.asyncProperty(fileArb, fc.nat(), fc.constantFrom(0x00, 0xff, 0xc3), async (f, at, byte) => {
        const { lines } = writeFile(f);
        const bytes = toBytes(lines, f.layout.eol, false);
        const position = at % bytes.length;
        // 0xC3 starts a two-byte sequence; followed by an ASCII byte (or nothing) it is invalid UTF-8.
        const corrupted = new Uint8Array([...bytes.subarray(0, position), byte, ...bytes.subarray(position)]);
        const r = await parseDispersionFile(chunked(corrupted, f.layout.chunkSize), mappingFor(f.layout.delimiter, true));
        expect(r.ok).toBe(false);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });
});
