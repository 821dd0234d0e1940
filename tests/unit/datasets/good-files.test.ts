import { Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { type DispersionParseResult, datasetMappingSchema, parseDispersionFile } from "@/lib/datasets";
import { chunked, longMapping } from "./helpers";

const accepted = (result: DispersionParseResult) => {
  if (!result.ok) throw new Error(`refused: ${JSON.stringify(result.issues)}`);
  return result;
};

const encode = (text: string) => new TextEncoder().encode(text);

// A small two-band file; every layout variant below must give exactly these points.
const expected = [
  { k: [0, 0, 0], band: 1, energy: -1.5 },
  { k: [0, 0, 0], band: 2, energy: 2 },
  { k: [0.3, 0.4, 0], band: 1, energy: -1.25 },
  { k: [0.3, 0.4, 0], band: 2, energy: 1.75 },
];

const pointsOf = (r: DispersionParseResult) => accepted(r).points.map(({ k, band, energy }) => ({ k, band, energy }));

describe("accepted layouts", () => {
  const rows = [["0", "0", "1", "-1.5"], ["0", "0", "2", "2"], ["0.3", "0.4", "1", "-1.25"], ["0.3", "0.4", "2", "1.75"]];
  const file = (sep: string, eol = "\n") => [["kx", "ky", "band", "E"], ...rows].map((r) => r.join(sep)).join(eol) + eol;

  it.each([
    ["comma", ","],
    ["tab", "\t"],
    ["semicolon", ";"],
    ["whitespace", "   "],
  ])("detects the %s delimiter", async (name, sep) => {
    const r = accepted(await parseDispersionFile(file(sep), longMapping()));
    expect(r.summary.delimiter).toBe(name === "whitespace" ? "whitespace" : sep);
    expect(pointsOf(r)).toEqual(expected);
  });

  it("reads an explicit delimiter", async () => {
    expect(pointsOf(await parseDispersionFile(file(";"), longMapping({ delimiter: ";" })))).toEqual(expected);
  });

  it("strips a byte-order mark, accepts CRLF, comments, blank lines and quoted fields", async () => {
    const text = '\uFEFF# Halvorsen Quantum Materials Lab, sample HQ-7\r\n"kx","ky","band","E"\r\n\r\n' +
      '0,0,"1",-1.5\r\n  # a comment inside\r\n0,0,2,"2"\r\n0.3,0.4,1,-1.25\r\n"0.3",0.4,2,1.75';
    const r = accepted(await parseDispersionFile(text, longMapping()));
    expect(pointsOf(r)).toEqual(expected);
    // Rows are the lines an editor shows: BOM line 1 is the comment, the header is line 2.
    expect(r.points.map((p) => p.row)).toEqual([4, 6, 7, 8]);
  });

  it("keeps a quoted label with the delimiter and a line break inside it", async () => {
    const text = 'kx,ky,band,E,cut\n0,0,1,-1.5,"Γ, first\ncut"\n0.3,0.4,1,-1.25,plain\n';
    const r = accepted(await parseDispersionFile(text, longMapping({ label: { column: "cut" } })));
    expect(r.points.map((p) => [p.row, p.label])).toEqual([[2, "Γ, first\ncut"], [4, "plain"]]);
  });

  it("reads the same points from a Node Readable, a Web ReadableStream and 1-byte chunks", async () => {
    // "Γ" is two bytes in UTF-8: 1-byte chunks split it, and the decoder must join it again.
    const text = "kx,ky,band,E,cut\n" + rows.map((r) => [...r, "Γ–X"].join(",")).join("\n");
    const bytes = encode(text);
    const mapping = longMapping({ label: { column: "cut" } });
    const web = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(bytes.subarray(0, 7));
        controller.enqueue(bytes.subarray(7));
        controller.close();
      },
    });
    for (const source of [Readable.from([Buffer.from(bytes)]), web, chunked(bytes, 1)]) {
      const r = accepted(await parseDispersionFile(source, mapping));
      expect(pointsOf(r)).toEqual(expected);
      expect(r.points.every((p) => p.label === "Γ–X")).toBe(true);
    }
  });

  it("reads wide format: one row per k-point, one energy column per band in the mapping's order", async () => {
    const text = "kx ky E2_Ry E1_Ry\n0 0 0.5 -0.25\n0.3 0.4 1 -0.5\n";
    const mapping = datasetMappingSchema.parse({
      name: "wide", source: "calculation", format: "wide",
      k: { kind: "cartesian", columns: ["kx", "ky"] },
      energy: { columns: ["E1_Ry", "E2_Ry"], unit: "Ry" },
    });
    const r = accepted(await parseDispersionFile(text, mapping));
    // CODATA 2018 (REFERENCES.md §7): 1 Ry = 13.605693122994 eV.
    expect(r.points.map((p) => [p.kIndex, p.band, p.energy])).toEqual([
      [0, 1, -0.25 * 13.605693122994],
      [0, 2, 0.5 * 13.605693122994],
      [1, 1, -0.5 * 13.605693122994],
      [1, 2, 13.605693122994],
    ]);
    expect(r.summary).toMatchObject({ pointCount: 4, bandCount: 2, kPointCount: 2 });
  });

  it("reads Fortran D exponents (common practice in DFT output)", async () => {
    const r = accepted(await parseDispersionFile("kx,ky,band,E\n0,0,1,-1.5D+00\n", longMapping()));
    expect(r.points[0].energy).toBe(-1.5);
  });
});

describe("a 2D photoemission-style file", () => {
  // An invented ARPES peak list of the Halvorsen Quantum Materials Lab: (kx, ky) in 1/Å, E − E_F and its
  // error bar in meV, two cuts. meV → eV is the SI prefix 10⁻³ (BIPM SI Brochure, 9th ed.).
  const text = [
    "# sample HQ-12, 21.2 eV photons",
    "cut,kx,ky,branch,E (meV),dE (meV)",
    "A,-0.10,0.00,1,-212.5,4.0",
    "A,0.00,0.00,1,-250.0,3.5",
    "A,0.10,0.00,1,-212.5,4.5",
    "B,0.10,0.10,1,-180.0,6.0",
    "B,0.10,0.10,2,-35.0,8.0",
  ].join("\n");
  const mapping = datasetMappingSchema.parse({
    name: "HQ-12 cuts A and B", source: "photoemission", energyReference: "Fermi level", format: "long",
    k: { kind: "cartesian", columns: ["kx", "ky"] },
    band: { column: "branch" }, energy: { column: "E (meV)", unit: "meV" },
    sigma: { column: "dE (meV)" }, label: { column: "cut" },
  });

  it("keeps σ in eV, the cut labels, and kz = 0", async () => {
    const r = accepted(await parseDispersionFile(text, mapping));
    [0.004, 0.0035, 0.0045, 0.006, 0.008].forEach((s, i) => expect(r.points[i].sigma).toBeCloseTo(s, 15));
    expect(r.points[0].energy).toBeCloseTo(-0.2125, 15);
    expect(r.points.map((p) => p.label)).toEqual(["A", "A", "A", "B", "B"]);
    expect(r.points.every((p) => p.k[2] === 0)).toBe(true);
    expect(r.summary).toMatchObject({ hasSigma: true, hasLabel: true, bandCount: 2, kPointCount: 4 });
  });

  it("lays the cuts end to end: cut A by projection on its line, cut B after a gap, ticks at the cuts", async () => {
    const r = accepted(await parseDispersionFile(text, mapping));
    // Hand-computed: cut A lies on ky = 0, so its axis is kx − min kx = 0, 0.1, 0.2 (length 0.2); cut B is one
    // k-point (length 0); the gap is CUT_GAP_FRACTION (5 %) of the summed lengths, 0.01, so B sits at 0.21.
    const d = r.points.map((p) => p.pathDistance);
    [0, 0.1, 0.2, 0.21, 0.21].forEach((v, i) => expect(d[i]).toBeCloseTo(v, 12));
    expect(r.summary.ticks.map((t) => t.label)).toEqual(["A", "B"]);
    expect(r.summary.ticks[1].pathDistance).toBeCloseTo(0.21, 12);
  });

  it("takes σ in its own unit when the mapping says so", async () => {
    const r = accepted(
      await parseDispersionFile(text, { ...mapping, sigma: { column: "dE (meV)", unit: "eV" } }),
    );
    expect(r.points[0].sigma).toBe(4);
  });
});
