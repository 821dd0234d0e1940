import { describe, expect, it } from "vitest";
import { bandColour, bandDash, bandMarker, bandPalette, okabeItoPalette } from "@/lib/views/palette";

/** WCAG 2.2 contrast ratio of a colour on white (relative luminance, sRGB; WCAG 2.2 "relative luminance"). */
function contrastOnWhite(hex: string): number {
  const channels = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
  const [r, g, b] = channels.map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  const luminance = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  return 1.05 / (luminance + 0.05);
}

describe("band palette", () => {
  it("holds the eight Okabe–Ito colours", () => {
    // Okabe & Ito (2008), Color Universal Design: RGB (230,159,0), (86,180,233), (0,158,115),
    // (240,228,66), (0,114,178), (213,94,0), (204,121,167), (0,0,0) — from memory of the published table.
    expect(okabeItoPalette.map((c) => c.hex)).toEqual([
      "#E69F00", "#56B4E9", "#009E73", "#F0E442", "#0072B2", "#D55E00", "#CC79A7", "#000000",
    ]);
  });

  // WCAG 2.2 SC 1.4.11 (non-text contrast): graphical objects need 3:1 against their background.
  it("draws a darker yellow on white: Okabe–Ito's yellow fails 3:1, ours passes", () => {
    expect(contrastOnWhite("#F0E442")).toBeLessThan(1.5);
    const yellow = bandPalette[3];
    expect(yellow).toEqual({ name: "dark yellow", hex: "#9E8C00" });
    expect(contrastOnWhite(yellow.hex)).toBeGreaterThan(3);
    expect(bandPalette.filter((c, i) => c.hex !== okabeItoPalette[i].hex)).toHaveLength(1);
  });

  it("cycles after eight bands, with a new marker and dash each round, and refuses bad indices", () => {
    expect(bandColour(8)).toBe(bandColour(0));
    expect(bandColour(9)).toBe("#56B4E9");
    expect(bandColour(3)).toBe("#9E8C00");
    expect([0, 7, 8, 15, 16, 24, 32, 40].map(bandMarker)).toEqual(["circle", "circle", "square", "square", "triangle", "diamond", "cross", "circle"]);
    expect([0, 8, 16, 24, 32].map(bandDash)).toEqual([undefined, "5 3", "1.5 2.5", "8 3 2 3", undefined]);
    expect(() => bandColour(-1)).toThrow(/non-negative/);
    expect(() => bandMarker(1.5)).toThrow(/integer/);
  });
});
