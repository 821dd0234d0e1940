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

describe("sp3s* zinc-blende at Γ", () => {
  it("gives the 2×2 closed forms of the s and p blocks from its own parameters", () => {
    // At Γ all four neighbour phases are 1, so each anion–cation pair of like orbitals forms a 2×2 block:
    // E = (E_a + E_c)/2 ± √(((E_a − E_c)/2)² + V²) with V = 4V_ssσ (s) and V = (4/3)(V_ppσ + 2V_ppπ) (p)
    // (Vogl, Hjalmarson & Dow 1983, Γ-point expressions; from memory). s* does not couple at Γ.
    const doc = buildTemplate("zincblende-sp3s-star");
    const p = (name: string) => doc.parameters.find((x) => x.name === name)!.value;
    const pair = (ea: number, ec: number, v: number) => {
      const mid = (ea + ec) / 2;
      const half = Math.hypot((ea - ec) / 2, v);
      return [mid - half, mid + half];
    };
    const [s1, s2] = pair(p("E_s[As]"), p("E_s[Ga]"), 4 * p("V_ssσ[As–Ga,1]"));
    const [p1, p2] = pair(p("E_p[As]"), p("E_p[Ga]"), (4 / 3) * (p("V_ppσ[As–Ga,1]") + 2 * p("V_ppπ[As–Ga,1]")));
    const expected = [s1, s2, p1, p1, p1, p2, p2, p2, p("E_s*[As]"), p("E_s*[Ga]")].sort((a, b) => a - b);
    const energies = Array.from(computeBands(compileModel(doc), undefined, [[0, 0, 0]]).energies);
    expect(energies).toEqual(expected.map((e) => expect.closeTo(e, 10)));
    // combined elements recovered from the converted bond integrals (Vogl et al. 1983 GaAs, from memory)
    expect(4 * p("V_ssσ[As–Ga,1]")).toBeCloseTo(-6.4513, 10);
    expect((4 / Math.sqrt(3)) * p("V_spσ[Ga–As,1]")).toBeCloseTo(5.7839, 10);
  });
});
