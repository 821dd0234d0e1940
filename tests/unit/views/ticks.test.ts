import { describe, expect, it } from "vitest";
import { displayLabel, pathTicks, tickLabeller } from "@/lib/views/ticks";

describe("pathTicks", () => {
  it("sorts by position and spells Γ as the letter", () => {
    // The fcc path L–Γ–X (Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010)) as a file would list it.
    const ticks = pathTicks([
      { label: "X", position: 2.02 },
      { label: "L", position: 0 },
      { label: "G", position: 1.0 },
    ]);
    expect(ticks).toEqual([
      { label: "L", position: 0 },
      { label: "Γ", position: 1.0 },
      { label: "X", position: 2.02 },
    ]);
  });

  it("merges labels at one position (a jump in the path) in path order", () => {
    const ticks = pathTicks([
      { label: "X", position: 0 },
      { label: "K", position: 1.5 },
      { label: "U", position: 1.5 },
      { label: "Gamma", position: 3 },
    ]);
    expect(ticks.map((t) => t.label)).toEqual(["X", "K|U", "Γ"]);
  });

  it("does not repeat a label listed twice at one place", () => {
    expect(pathTicks([{ label: "Γ", position: 0 }, { label: "G", position: 0 }, { label: "M", position: 1 }])).toEqual([
      { label: "Γ", position: 0 },
      { label: "M", position: 1 },
    ]);
  });

  it("returns nothing for no ticks", () => {
    expect(pathTicks([])).toEqual([]);
  });
});

describe("tick labels", () => {
  it("keeps labels that are not spelled-out Greek letters", () => {
    expect(displayLabel("\\Gamma")).toBe("Γ");
    expect(displayLabel(" K ")).toBe("K");
    expect(displayLabel("W")).toBe("W");
  });

  it("labels tick positions and leaves others blank", () => {
    const label = tickLabeller([{ label: "Γ", position: 0 }, { label: "X", position: 1.157 }]);
    expect(label(1.157)).toBe("X");
    expect(label(0.5)).toBe("");
  });
});
