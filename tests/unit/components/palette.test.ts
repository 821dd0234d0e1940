import { describe, expect, it } from "vitest";
import { bandColour, okabeItoPalette } from "@/components/charts";

describe("band palette", () => {
  it("holds the eight Okabe–Ito colours", () => {
    // Okabe & Ito (2008), Color Universal Design: RGB (230,159,0), (86,180,233), (0,158,115),
    // (240,228,66), (0,114,178), (213,94,0), (204,121,167), (0,0,0) — from memory of the published table.
    expect(okabeItoPalette.map((c) => c.hex)).toEqual([
      "#E69F00", "#56B4E9", "#009E73", "#F0E442", "#0072B2", "#D55E00", "#CC79A7", "#000000",
    ]);
  });

  it("cycles after eight bands and refuses bad indices", () => {
    expect(bandColour(8)).toBe(bandColour(0));
    expect(bandColour(9)).toBe("#56B4E9");
    expect(() => bandColour(-1)).toThrow(/non-negative/);
    expect(() => bandColour(1.5)).toThrow(/integer/);
  });
});
