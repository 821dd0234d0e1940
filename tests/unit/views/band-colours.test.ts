import { describe, expect, it } from "vitest";
import { bandPairs } from "@/lib/views/band-mapping";
import { UNMAPPED_BAND_COLOUR, dataBandStyles, modelBandStyles } from "@/lib/views/band-colours";
import { okabeItoPalette } from "@/lib/views/palette";

// Colours: Okabe & Ito (2008), "Color Universal Design", in their published order.
const [orange, skyBlue, green] = okabeItoPalette.map((c) => c.hex);

describe("band styles", () => {
  it("gives data bands palette colours in ascending band order", () => {
    const styles = dataBandStyles([3, 1, 2, 1]);
    expect([...styles.entries()].map(([band, s]) => [band, s.colour])).toEqual([
      [1, orange],
      [2, skyBlue],
      [3, green],
    ]);
  });

  it("cycles the colours after eight bands and changes marker and dash as the second cue", () => {
    const styles = dataBandStyles(Array.from({ length: 17 }, (_, i) => i + 1));
    expect(styles.get(1)).toEqual({ colour: orange, marker: "circle", dash: undefined });
    expect(styles.get(8)).toMatchObject({ marker: "circle", dash: undefined });
    expect(styles.get(9)).toEqual({ colour: orange, marker: "square", dash: "5 3" });
    expect(styles.get(10)).toMatchObject({ colour: skyBlue, marker: "square" });
    expect(styles.get(17)).toMatchObject({ colour: orange, marker: "triangle" });
    // No two of these 17 bands share both colour and marker.
    const looks = new Set([...styles.values()].map((s) => `${s.colour} ${s.marker}`));
    expect(looks.size).toBe(17);
  });

  it("styles a model band like the data band mapped to it and the rest grey", () => {
    const styles = dataBandStyles([1, 2]);
    const pairs = bandPairs({ kind: "offset", firstModelBand: 3 }, [1, 2], 5);
    expect(modelBandStyles(5, pairs, styles).map((s) => s.colour)).toEqual([UNMAPPED_BAND_COLOUR, UNMAPPED_BAND_COLOUR, orange, skyBlue, UNMAPPED_BAND_COLOUR]);
  });
});

describe("bandPairs", () => {
  it("maps a contiguous range from the first model band and leaves the rest out", () => {
    expect(bandPairs({ kind: "offset", dataBands: [2, 3], firstModelBand: 1 }, [1, 2, 3, 4], 8)).toEqual([
      { dataBand: 1, modelBand: null, outOfRange: false },
      { dataBand: 2, modelBand: 1, outOfRange: false },
      { dataBand: 3, modelBand: 2, outOfRange: false },
      { dataBand: 4, modelBand: null, outOfRange: false },
    ]);
  });

  it("flags data bands that would map beyond the model's bands", () => {
    const pairs = bandPairs({ kind: "offset", firstModelBand: 2 }, [1, 2], 2);
    expect(pairs[1]).toEqual({ dataBand: 2, modelBand: 3, outOfRange: true });
  });

  it("pairs every data band with the nearest model band for nearest mapping", () => {
    expect(bandPairs({ kind: "nearest" }, [1, 2], 2).every((p) => p.modelBand === null)).toBe(true);
  });
});
