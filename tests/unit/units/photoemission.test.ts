import { describe, expect, it } from "vitest";
import { createRandom } from "@/lib/linalg";
import { FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV, anglesForCrystalMomentum, photoemissionToCrystal } from "@/lib/units";

describe("photoemission kinematics (Damascelli, Hussain & Shen, Rev. Mod. Phys. 75, 473 (2003))", () => {
  // Source: Damascelli et al. (2003), eq. (2): k∥ = 0.5123 Å⁻¹ eV^(−1/2) √E_kin sin θ. From the CODATA 2018
  // constants √(2 m_e · 1 eV)/ħ = 0.512317 Å⁻¹; the paper rounds it to 0.5123.
  it("derives the paper's 0.5123 Å⁻¹ eV^(−1/2) from the CODATA constants", () => {
    expect(FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV).toBeCloseTo(0.512317, 6);
  });

  // Worked value (REFERENCES.md §9, computed from eq. (2)): E_kin = 16.0 eV, θ = 10°, no tilt →
  // k∥ = 0.5123 × 4 × sin 10° = 0.5123 × 4 × 0.173648 = 0.35584 Å⁻¹ (0.35585 with the unrounded constant).
  // Inputs for the energies: hν = 21.2 eV (He Iα), φ = 4.5 eV → |E_B| = 21.2 − 4.5 − 16.0 = 0.7 eV (eq. (1)).
  it("gives the worked value k∥ = 0.35584 1/Å at E_kin = 16 eV, θ = 10°", () => {
    const k = photoemissionToCrystal({ thetaDegrees: 10, kineticEnergy: 16, photonEnergy: 21.2, workFunction: 4.5 });
    expect(k.kx).toBeCloseTo(0.35584, 4);
    expect(k.ky).toBe(0);
    expect(k.kParallel).toBeCloseTo(0.35584, 4);
    expect(k.bindingEnergy).toBeCloseTo(0.7, 12);
    expect(k.energy).toBeCloseTo(-0.7, 12);
    expect(k.kPerpendicular).toBeNull();
  });

  // Damascelli et al. (2003), eq. (4): k⊥ = 0.5123 √(E_kin cos²ϑ + V₀). Inputs: E_kin = 16 eV, θ = 10°,
  // V₀ = 10 eV → 0.512317 × √(16 × 0.969846 + 10) = 0.512317 × √25.517541 = 2.58796 1/Å.
  it("gives k⊥ from the inner potential (free-electron final state)", () => {
    const k = photoemissionToCrystal({ thetaDegrees: 10, kineticEnergy: 16, photonEnergy: 21.2, workFunction: 4.5, innerPotential: 10 });
    expect(k.kPerpendicular).toBeCloseTo(2.58796, 4);
  });

  // Geometry of lib/units/photoemission.ts: the direction (sin θ, cos θ sin τ, cos θ cos τ). At θ = 0 the
  // tilt alone gives k_y = K sin τ; |k| in the plane never exceeds K (the photoemission horizon).
  it("puts the tilt perpendicular to the slit", () => {
    const k = photoemissionToCrystal({ thetaDegrees: 0, tiltDegrees: 10, kineticEnergy: 16, photonEnergy: 21.2, workFunction: 4.5 });
    expect(k.kx).toBe(0);
    expect(k.ky).toBeCloseTo(0.35585, 4);
    const both = photoemissionToCrystal({ thetaDegrees: 30, tiltDegrees: 40, kineticEnergy: 16, photonEnergy: 21.2, workFunction: 4.5 });
    // |direction|² = sin²θ + cos²θ (sin²τ + cos²τ) = 1, so k_x² + k_y² + (K cos θ cos τ)² = K².
    const K = FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV * 4;
    const kz = K * Math.cos((30 * Math.PI) / 180) * Math.cos((40 * Math.PI) / 180);
    expect(both.kx ** 2 + both.ky ** 2 + kz ** 2).toBeCloseTo(K ** 2, 12);
  });

  // Round trip k → (θ, τ) → k on seeded random inputs inside the horizon (common practice for inverses).
  it("round-trips k → θ, τ → k", () => {
    const random = createRandom(18);
    for (let i = 0; i < 200; i++) {
      const kineticEnergy = 5 + 100 * random.uniform();
      const K = FREE_ELECTRON_WAVE_VECTOR_PER_SQRT_EV * Math.sqrt(kineticEnergy);
      const radius = 0.95 * K * random.uniform();
      const angle = 2 * Math.PI * random.uniform();
      const [kx, ky] = [radius * Math.cos(angle), radius * Math.sin(angle)];
      const angles = anglesForCrystalMomentum(kx, ky, kineticEnergy);
      const back = photoemissionToCrystal({ ...angles, kineticEnergy, photonEnergy: kineticEnergy + 5, workFunction: 4.5 });
      expect(back.kx).toBeCloseTo(kx, 10);
      expect(back.ky).toBeCloseTo(ky, 10);
    }
  });

  it("refuses a wave vector beyond the photoemission horizon and angles outside ±90°", () => {
    expect(() => anglesForCrystalMomentum(2.1, 0, 16)).toThrow(/is not reached at E_kin = 16 eV/);
    expect(() => photoemissionToCrystal({ thetaDegrees: 95, kineticEnergy: 16, photonEnergy: 21.2, workFunction: 4.5 })).toThrow();
  });
});
