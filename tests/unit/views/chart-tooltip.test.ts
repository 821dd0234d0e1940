import { describe, expect, it } from "vitest";
import { bandSortKey, tooltipSummary } from "@/lib/views/chart-tooltip";
import { correlationScaleStops } from "@/lib/views/heatmap";

describe("tooltipSummary", () => {
  // The payload of a ComposedChart axis tooltip over two scatter series and one line (recharts 3 gives
  // each scatter point an x and a y entry).
  const entries = [
    { dataKey: "x", value: 0.5, graphicalItemId: "data-1", color: "#E69F00" },
    { dataKey: "y", value: -1.25, graphicalItemId: "data-1", color: "#E69F00" },
    { dataKey: "x", value: 0.5, graphicalItemId: "data-2", color: "#56B4E9" },
    { dataKey: "y", value: 2.5, graphicalItemId: "data-2", color: "#56B4E9" },
    { dataKey: "y", value: -1.3, graphicalItemId: "fit-1", color: "#E69F00" },
    { dataKey: "y", value: -1.31, graphicalItemId: "fit-1", color: "#E69F00" },
    { dataKey: "y", value: null, graphicalItemId: "fit-2" },
  ];
  const labels = new Map([
    ["data-1", "data band 1"],
    ["data-2", "data band 2"],
    ["fit-1", "revision 1 band 1"],
  ]);

  it("shows x once and one value per series", () => {
    const summary = tooltipSummary(entries, labels);
    expect(summary.x).toBe(0.5);
    expect(summary.rows).toEqual([
      { id: "data-1", label: "data band 1", value: -1.25, colour: "#E69F00" },
      { id: "data-2", label: "data band 2", value: 2.5, colour: "#56B4E9" },
      { id: "fit-1", label: "revision 1 band 1", value: -1.3, colour: "#E69F00" },
    ]);
  });

  it("has no x when no entry carries one", () => {
    expect(tooltipSummary([{ dataKey: "y", value: 1, graphicalItemId: "a" }], new Map()).x).toBeNull();
  });
});

describe("bandSortKey", () => {
  it("orders band labels by number, not as text", () => {
    const labels = ["Band 1", "Band 10", "Band 11", "Band 12", "Band 2", "Band 3"];
    expect([...labels].sort((a, b) => bandSortKey(a) - bandSortKey(b))).toEqual(["Band 1", "Band 2", "Band 3", "Band 10", "Band 11", "Band 12"]);
    expect(bandSortKey("model")).toBeGreaterThan(bandSortKey("band 999"));
  });
});

describe("correlationScaleStops", () => {
  it("runs from Okabe–Ito blue at −1 through near-white at 0 to vermillion at +1", () => {
    const stops = correlationScaleStops();
    expect(stops.map((s) => s.value)).toEqual([-1, -0.75, -0.5, -0.25, 0, 0.25, 0.5, 0.75, 1]);
    expect(stops[0].fill).toBe("rgb(0, 114, 178)");
    expect(stops[4].fill).toBe("rgb(247, 247, 247)");
    expect(stops[8].fill).toBe("rgb(213, 94, 0)");
    expect(() => correlationScaleStops(1)).toThrow(/at least 2/);
  });
});

describe("tooltipSummary on another x key", () => {
  it("reads the path distance from the named key", () => {
    const summary = tooltipSummary(
      [
        { dataKey: "pathDistance", value: 1.5, graphicalItemId: "band-1" },
        { dataKey: "energy", value: -2, graphicalItemId: "band-1" },
      ],
      new Map([["band-1", "Band 1"]]),
      "pathDistance",
    );
    expect(summary).toEqual({ x: 1.5, rows: [{ id: "band-1", label: "Band 1", value: -2, colour: undefined }] });
  });
});
