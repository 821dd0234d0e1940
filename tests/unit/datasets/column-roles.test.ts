import { describe, expect, it } from "vitest";
import { guessColumnRoles, guessEnergyUnit, previewDelimitedText } from "@/lib/datasets";

// Header conventions seen in DFT post-processing and ARPES peak lists (common practice); the Si header is
// the real file's (all-electron PBE band structure of Si computed with Elk 8.4.30, shared/data).

describe("column role guesses", () => {
  it("reads the Si file's header: Cartesian k preferred, band, energy in eV", () => {
    const header = ["k_frac_1", "k_frac_2", "k_frac_3", "k_cart_x", "k_cart_y", "k_cart_z", "path_distance", "band", "energy_eV"];
    const g = guessColumnRoles(header);
    expect(g.columns.map((c) => c.role)).toEqual([
      "kReduced", "kReduced", "kReduced", "kCartesian", "kCartesian", "kCartesian", "pathDistance", "band", "energy",
    ]);
    expect(g.suggestion).toEqual({
      k: { kind: "cartesian", columns: ["k_cart_x", "k_cart_y", "k_cart_z"] },
      format: "long",
      band: { column: "band" },
      energy: { column: "energy_eV", unit: "eV" },
    });
  });

  it("reads a photoemission header with meV units, error bars and a cut label; branch is the band", () => {
    const g = guessColumnRoles(["cut", "kx", "ky", "branch", "E (meV)", "dE (meV)", "note"]);
    expect(g.columns.map((c) => c.role)).toEqual(["label", "kCartesian", "kCartesian", "band", "energy", "sigma", "ignore"]);
    expect(g.suggestion).toEqual({
      k: { kind: "cartesian", columns: ["kx", "ky"] },
      format: "long",
      band: { column: "branch" },
      energy: { column: "E (meV)", unit: "meV" },
      sigma: { column: "dE (meV)", unit: "meV" },
      label: { column: "cut" },
    });
    expect(g.columns.at(-1)).toEqual({ column: "note", role: "ignore" });
  });

  it("keeps branch as the label when the file has a band column, and cut or label always as the label", () => {
    const g = guessColumnRoles(["kx", "band", "branch", "E"]);
    expect(g.columns.map((c) => c.role)).toEqual(["kCartesian", "band", "label", "energy"]);
    expect(g.suggestion).toMatchObject({ band: { column: "band" }, label: { column: "branch" } });
    const labelled = guessColumnRoles(["label", "kx", "branch", "E"]);
    expect(labelled.columns.map((c) => c.role)).toEqual(["label", "kCartesian", "band", "energy"]);
    expect(labelled.suggestion).toMatchObject({ band: { column: "branch" }, label: { column: "label" } });
  });

  it("suggests wide format for numbered energy columns without a band column, in numeric order", () => {
    const g = guessColumnRoles(["dist", "band10_Ry", "band2_Ry", "band1_Ry"]);
    expect(g.suggestion.format).toBe("wide");
    expect(g.suggestion.k).toEqual({ kind: "path", column: "dist" });
    expect(g.suggestion.energy).toEqual({ columns: ["band1_Ry", "band2_Ry", "band10_Ry"], unit: "Ry" });
  });

  it("reads unit suffixes", () => {
    expect(["energy_eV", "E (meV)", "dE[meV]", "e_Ry", "E/Ha", "E_hartree", "energy"].map(guessEnergyUnit)).toEqual([
      "eV", "meV", "meV", "Ry", "Ha", "Ha", undefined,
    ]);
  });
});

describe("file preview", () => {
  const bytes = new TextEncoder().encode("\uFEFF# HQ-3\nkx\tky\tband\tE_eV\n0\t0\t1\t-1\n0.1\t0\t1\t-0.9\n0.2\t0\t1\t-0.7\n");

  it("shows the first rows with their line numbers, the delimiter and the guesses", async () => {
    const p = await previewDelimitedText(bytes, { maxRows: 2 });
    if (!p.ok) throw new Error(p.issue.message);
    expect(p).toMatchObject({ delimiter: "\t", headerRow: 2, header: ["kx", "ky", "band", "E_eV"] });
    expect(p.rows).toEqual([{ row: 3, fields: ["0", "0", "1", "-1"] }, { row: 4, fields: ["0.1", "0", "1", "-0.9"] }]);
    expect(p.guess.suggestion.energy).toEqual({ column: "E_eV", unit: "eV" });
  });

  it("drops a line cut by the slice, even inside a multi-byte character", async () => {
    const text = new TextEncoder().encode("kx,band,E,cut\n0,1,1,Γ\n0.1,1,2,Γ");
    const cut = text.subarray(0, text.length - 1); // ends inside the two bytes of "Γ"
    const p = await previewDelimitedText(cut, { truncated: true });
    if (!p.ok) throw new Error(p.issue.message);
    expect(p.rows).toEqual([{ row: 2, fields: ["0", "1", "1", "Γ"] }]);
  });

  it("reports binary data", async () => {
    const p = await previewDelimitedText(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00]));
    expect(p.ok).toBe(false);
  });
});
