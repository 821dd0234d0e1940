// The band fit's checks for values that are not results although their local statistics may look fine:
// runaway values beyond the data's energy scale, and standard errors larger than it.
import { describe, expect, it } from "vitest";
import { RUNAWAY_FACTOR, dataEnergyScale, implausibleParameterWarnings } from "@/lib/fit/bands/plausibility";
import type { FittedParameter } from "@/lib/fit";

const fitted = (name: string, value: number, standardError: number | null, free = true): FittedParameter => ({
  name,
  value,
  standardError,
  free,
  atBound: null,
});

describe("data energy scale", () => {
  it("is the larger of the energy range and the largest |E| (eV)", () => {
    expect(dataEnergyScale([-12, -3, 0])).toBe(12); // range 12, largest |E| 12
    expect(dataEnergyScale([-6, -5])).toBe(6); // range 1, largest |E| 6: on-site energies follow the data's zero
    expect(dataEnergyScale([-2, 8])).toBe(10); // range 10
    expect(dataEnergyScale([])).toBe(0);
  });
});

describe("implausible parameter values", () => {
  const scale = 12; // eV
  it("flags an energy that ran away beyond 10 × the data's scale, and nothing within it", () => {
    const warnings = implausibleParameterWarnings(
      [
        { parameter: fitted("E_s*[Si]", RUNAWAY_FACTOR * scale * 1.01, 5), unit: "eV", isOverlap: false },
        { parameter: fitted("E_s[Si]", -RUNAWAY_FACTOR * scale * 0.99, 0.1), unit: "eV", isOverlap: false },
      ],
      scale,
    );
    expect(warnings.map((w) => [w.kind, w.parameters])).toEqual([["undetermined", ["E_s*[Si]"]]]);
    expect(warnings[0].message).toContain("ran away");
  });

  it("flags a standard error above the data's scale but not a small value with a smaller error", () => {
    const warnings = implausibleParameterWarnings(
      [
        { parameter: fitted("V_s*pσ[Si–Si,1]", 20, 13), unit: "eV", isOverlap: false },
        // 0.001 ± 0.003 eV: consistent with zero, but the data do pin it to a few meV — determined.
        { parameter: fitted("t''", 0.001, 0.003), unit: "eV", isOverlap: false },
      ],
      scale,
    );
    expect(warnings.map((w) => w.parameters)).toEqual([["V_s*pσ[Si–Si,1]"]]);
    expect(warnings[0].message).toContain("standard error");
  });

  it("flags an overlap of magnitude ≥ 1 (Cauchy–Schwarz for normalised orbitals) but not a renormalisation factor of 2", () => {
    const warnings = implausibleParameterWarnings(
      [
        { parameter: fitted("S_ppπ[C–C,1]", -1.2, 0.01), unit: "1", isOverlap: true },
        { parameter: fitted("renormalisation", 2, 0.05), unit: "1", isOverlap: false },
        { parameter: fitted("S_ppπ[C–C,2]", 0.1, 1.5), unit: "1", isOverlap: true },
      ],
      scale,
    );
    expect(warnings.map((w) => w.parameters)).toEqual([["S_ppπ[C–C,1]"], ["S_ppπ[C–C,2]"]]);
  });

  it("ignores fixed parameters", () => {
    expect(implausibleParameterWarnings([{ parameter: fitted("E_s*[Si]", 1e6, null, false), unit: "eV", isOverlap: false }], scale)).toEqual([]);
  });
});
