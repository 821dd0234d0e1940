import { describe, expect, it } from "vitest";
import {
  BOHR_IN_ANGSTROM,
  bohrToAngstrom,
  inverseBohrToInverseAngstrom,
  toElectronvolts,
  twoPiOverAToInverseAngstrom,
} from "@/lib/units";

describe("energy units → eV", () => {
  // Source: CODATA 2018 recommended values (REFERENCES.md §7): 1 Ha = 27.211386245988 eV.
  it("converts Hartree with the CODATA 2018 factor", () => {
    expect(toElectronvolts(1, "Ha")).toBe(27.211386245988);
    expect(toElectronvolts(-0.5, "Ha")).toBeCloseTo(-13.605693122994, 12);
  });

  // Source: CODATA 2018 (REFERENCES.md §7): 1 Ry = 13.605693122994 eV, and Ry = Ha/2 by definition.
  it("converts Rydberg with the CODATA 2018 factor, half a Hartree", () => {
    expect(toElectronvolts(1, "Ry")).toBe(13.605693122994);
    expect(toElectronvolts(2, "Ry")).toBeCloseTo(toElectronvolts(1, "Ha"), 11);
  });

  // Source: SI prefix milli = 10⁻³ (BIPM SI Brochure, 9th ed., Table 7).
  it("converts meV and leaves eV alone", () => {
    expect(toElectronvolts(-250, "meV")).toBeCloseTo(-0.25, 15);
    expect(toElectronvolts(1.234, "eV")).toBe(1.234);
  });
});

describe("length and wave-vector units", () => {
  // Source: CODATA 2018 (REFERENCES.md §7): 1 bohr = 0.529177210903 Å.
  it("converts bohr to Å and 1/bohr to 1/Å", () => {
    expect(bohrToAngstrom(10)).toBeCloseTo(5.29177210903, 12);
    expect(inverseBohrToInverseAngstrom(1)).toBeCloseTo(1 / BOHR_IN_ANGSTROM, 12);
    // Hand-computed: 1/0.529177210903 = 1.8897261246 1/Å.
    expect(inverseBohrToInverseAngstrom(1)).toBeCloseTo(1.8897261246, 9);
  });

  // Textbook definition k = (2π/a)·κ (Ashcroft & Mermin, ch. 8); hand-computed for Si, a = 5.431 Å:
  // the X point (2π/a)(1, 0, 0) has |k| = 6.283185307/5.431 = 1.156911307 1/Å.
  it("converts units of 2π/a to 1/Å", () => {
    expect(twoPiOverAToInverseAngstrom(1, 5.431)).toBeCloseTo(1.156911307, 9);
    expect(twoPiOverAToInverseAngstrom(-0.5, 5.431)).toBeCloseTo(-0.5784556535, 9);
  });
});
