import { describe, expect, it } from "vitest";
import { buildTemplate } from "@/lib/tb";
import { chartResiduals, niceStep, dataSeriesByBand, distinctKPoints, energyDomain, modelBandLines, modelEnergiesByKIndex } from "@/lib/views/band-series";
import { revisionAlignment } from "@/lib/fit/bands/energy-alignment";

describe("dataSeriesByBand", () => {
  it("groups points by band and sorts each along the path", () => {
    const series = dataSeriesByBand([
      { band: 2, pathDistance: 1, energy: 3 },
      { band: 1, pathDistance: 1, energy: -1 },
      { band: 1, pathDistance: 0, energy: -2 },
    ]);
    expect(series).toEqual([
      { band: 1, points: [{ x: 0, y: -2 }, { x: 1, y: -1 }] },
      { band: 2, points: [{ x: 1, y: 3 }] },
    ]);
  });
});

describe("modelBandLines", () => {
  // Single-band chain: E(k) = E_s − 2t cos(ka) with H = −t Σ c†c (Ashcroft & Mermin, Solid State Physics, ch. 10;
  // the chain-s template's own convention).
  const chain = buildTemplate("chain-s");
  const a = chain.lattice[0][0];
  const onsite = chain.parameters.find((p) => p.name.startsWith("E_"))?.value ?? 0;
  const hopping = chain.parameters.find((p) => !p.name.startsWith("E_"))!.value;

  it("follows the chain's closed form along the data's k-points, sorted by path distance", () => {
    const kPoints = [0.5, 0, 1].map((f) => ({ k: [(f * Math.PI) / a, 0, 0] as [number, number, number], pathDistance: (f * Math.PI) / a }));
    const [line] = modelBandLines(chain, kPoints);
    expect(line.points.map((p) => p.x)).toEqual([0, (0.5 * Math.PI) / a, Math.PI / a]);
    const expected = [0, 0.5, 1].map((f) => onsite - 2 * hopping * Math.cos(f * Math.PI));
    line.points.forEach((p, i) => expect(p.y).toBeCloseTo(expected[i], 9));
  });

  it("applies the fit's offset and renormalisation, E_ref + (E − E_ref)/Z + δ", () => {
    const kPoints = [{ k: [0, 0, 0] as [number, number, number], pathDistance: 0 }];
    const [line] = modelBandLines(chain, kPoints, { offset: 0.1, renormalisation: 2, reference: 0.5 });
    const gamma = onsite - 2 * hopping;
    expect(line.points[0].y).toBeCloseTo(0.5 + (gamma - 0.5) / 2 + 0.1, 12); // convention of lib/fit/bands/schema.ts
  });

  it("breaks the line where two k-points share a path distance (a jump)", () => {
    const kPoints = [
      { k: [0, 0, 0] as [number, number, number], pathDistance: 0 },
      { k: [1, 0, 0] as [number, number, number], pathDistance: 1 },
      { k: [0.2, 0, 0] as [number, number, number], pathDistance: 1 },
    ];
    const [line] = modelBandLines(chain, kPoints);
    expect(line.points.map((p) => p.y === null)).toEqual([false, false, true, false]);
  });
});

describe("distinctKPoints and energyDomain", () => {
  it("keeps one k-point per k index", () => {
    const points = [0, 0, 1].map((kIndex, i) => ({ kIndex, k: [kIndex, 0, 0] as [number, number, number], pathDistance: kIndex + i * 0 }));
    expect(distinctKPoints(points)).toHaveLength(2);
  });

  it("pads the data range by 5 % to round steps unless a zoom window is given", () => {
    const points = [{ band: 1, pathDistance: 0, energy: -1 }, { band: 1, pathDistance: 1, energy: 1 }];
    // −1.1…1.1 spans 2.2 eV; 2.2/6 ≈ 0.37 rounds up to a step of 0.5 eV
    expect(energyDomain(points)).toEqual([-1.5, 1.5]);
    expect(niceStep(0.37)).toBe(0.5);
    expect(niceStep(3)).toBe(5);
    expect(niceStep(0.011)).toBeCloseTo(0.02, 15);
    expect(energyDomain(points, { min: -0.5, max: 0.5 })).toEqual([-0.5, 0.5]);
  });
});

describe("chartResiduals and revisionAlignment", () => {
  const energies = new Map([[0, [-1, 2]], [1, [-0.5, 1.5]]]);
  const points = [
    { kIndex: 0, band: 1, pathDistance: 0, energy: -1.1 },
    { kIndex: 1, band: 2, pathDistance: 1, energy: 1.4 },
    { kIndex: 1, band: 3, pathDistance: 1, energy: 9 },
  ];

  it("compares each point with its mapped model band and drops unmapped and out-of-window points", () => {
    const r = chartResiduals(points, energies, (b) => (b <= 2 ? b : null));
    expect(r.map((x) => x.band)).toEqual([1, 2]);
    expect(r[0].y).toBeCloseTo(0.1, 12); // model − data: −1 − (−1.1)
    expect(r[1].y).toBeCloseTo(0.1, 12);
    expect(chartResiduals(points, energies, (b) => (b <= 2 ? b : null), { min: 0, max: 5 })).toHaveLength(1);
  });

  it("uses the closest model band for nearest mapping", () => {
    const r = chartResiduals(points.slice(0, 2), energies, () => "nearest");
    expect(r.map((x) => x.y)).toEqual([expect.closeTo(0.1, 12), expect.closeTo(0.1, 12)]);
  });

  it("takes δ and Z from fitted parameters when present, else from the options", () => {
    const options = { energyOffset: { value: 0.2 }, renormalisation: { value: 1.5, reference: -0.1 } };
    expect(revisionAlignment([{ name: "energy offset", value: 0.05 }], options)).toEqual({ offset: 0.05, renormalisation: 1.5, reference: -0.1 });
  });
});

describe("modelEnergiesByKIndex", () => {
  it("gives the chain's closed form at each k index", () => {
    // E(k) = E_s − 2t cos(ka), the chain-s template's convention (Ashcroft & Mermin, ch. 10).
    const chain = buildTemplate("chain-s");
    const a = chain.lattice[0][0];
    const t = chain.parameters.find((p) => p.name === "t")!.value;
    const map = modelEnergiesByKIndex(chain, [{ kIndex: 7, k: [Math.PI / a, 0, 0] }]);
    expect(map.get(7)![0]).toBeCloseTo(2 * t, 9);
  });
});
