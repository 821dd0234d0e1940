import { describe, expect, it } from "vitest";
import { okabeItoPalette } from "@/components/charts/palette";
import { bandPairs } from "@/lib/views/band-mapping";
import { UNMAPPED_BAND_COLOUR, dataBandColours, modelBandColours } from "@/lib/views/band-colours";

// Colours: Okabe & Ito (2008), "Color Universal Design", in their published order.
const [orange, skyBlue, green] = okabeItoPalette.map((c) => c.hex);

describe("band colours", () => {
  it("gives data bands palette colours in ascending band order", () => {
    const colours = dataBandColours([3, 1, 2, 1]);
    expect([...colours.entries()]).toEqual([
      [1, orange],
      [2, skyBlue],
      [3, green],
    ]);
  });

  it("cycles after eight bands", () => {
    const colours = dataBandColours(Array.from({ length: 10 }, (_, i) => i + 1));
    expect(colours.get(9)).toBe(orange);
    expect(colours.get(10)).toBe(skyBlue);
  });

  it("colours a model band like the data band mapped to it and the rest grey", () => {
    const colours = dataBandColours([1, 2]);
    const pairs = bandPairs({ kind: "offset", firstModelBand: 3 }, [1, 2], 5);
    expect(modelBandColours(5, pairs, colours)).toEqual([UNMAPPED_BAND_COLOUR, UNMAPPED_BAND_COLOUR, orange, skyBlue, UNMAPPED_BAND_COLOUR]);
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
