import { describe, expect, it } from "vitest";
import { type Vec3, buildTemplate, compileModel, computeBands } from "@/lib/tb";

// Vogl, Hjalmarson & Dow, J. Phys. Chem. Solids 44, 365 (1983): silicon sp3s* parameters; band energies at
// Γ, X, L computed from the published parameters (REFERENCES.md §3), a = 5.431 Å.
describe("sp3s* silicon (Vogl–Hjalmarson–Dow 1983)", () => {
  const a = 5.431;
  const g = (2 * Math.PI) / a;
  const compiled = compileModel(buildTemplate("diamond-sp3s-star"));
  const at = (k: Vec3) => Array.from(computeBands(compiled, undefined, [k]).energies);

  it("Γ: −12.500; 0 (×3); 3.430 (×3); 4.100; 6.685 (×2), i.e. E(s) ± |V(s,s)| and E(p) ± V(x,x)", () => {
    const expected = [-12.5, 0, 0, 0, 3.43, 3.43, 3.43, 4.1, 6.685, 6.685];
    expect(at([0, 0, 0])).toEqual(expected.map((e) => expect.closeTo(e, 4)));
  });

  it("X = (2π/a)(1,0,0): −8.2737, −2.860, 1.630, 6.290, 10.8437 (each ×2)", () => {
    const expected = [-8.2737, -8.2737, -2.86, -2.86, 1.63, 1.63, 6.29, 6.29, 10.8437, 10.8437];
    expect(at([g, 0, 0])).toEqual(expected.map((e) => expect.closeTo(e, 3)));
  });

  it("L = (π/a)(1,1,1): −10.0811, −7.0790, −1.430 (×2), 2.4957, 2.5098, 4.860 (×2), 9.2158, 11.3387", () => {
    const expected = [-10.0811, -7.079, -1.43, -1.43, 2.4957, 2.5098, 4.86, 4.86, 9.2158, 11.3387];
    expect(at([g / 2, g / 2, g / 2])).toEqual(expected.map((e) => expect.closeTo(e, 3)));
  });

  it("conduction-band minimum along Γ–X: 1.1713 eV at 0.731 × 2π/a (indirect gap)", () => {
    const ks: Vec3[] = Array.from({ length: 1001 }, (_, i) => [(g * i) / 1000, 0, 0]);
    const { energies } = computeBands(compiled, undefined, ks);
    let best = Infinity;
    let where = 0;
    ks.forEach((_, i) => {
      if (energies[i * 10 + 4] < best) {
        best = energies[i * 10 + 4];
        where = i / 1000;
      }
    });
    expect(best).toBeCloseTo(1.1713, 3);
    expect(where).toBeCloseTo(0.731, 2);
  });
});
