import type { CompiledModel } from "../model/compile";
import type { ModelDocument } from "../model/schema";
import type { BondType } from "./bond-types";

/** ħ²/m_e in eV·Å², the value Harrison uses (CODATA 2018: 7.619964). */
export const HBAR2_OVER_M = 7.62;

/**
 * Harrison's universal coefficients η for sp bond integrals, V = η ħ²/(m d²) — Harrison, *Electronic
 * Structure and the Properties of Solids* (1980), Solid State Table (the 1980 set; later papers use
 * another set which must not be mixed in).
 */
export const HARRISON_ETA = { "ssσ": -1.4, "spσ": 1.84, "ppσ": 3.24, "ppπ": -0.81 } as const;

export type HarrisonBondType = keyof typeof HARRISON_ETA;

/**
 * Harrison's universal sp bond integrals at a bond length.
 * @param distance - bond length d, Å
 * @returns V_ssσ, V_spσ, V_ppσ, V_ppπ in eV
 */
export function harrisonBondIntegrals(distance: number): Record<HarrisonBondType, number> {
  if (!(distance > 0)) throw new RangeError("bond length must be positive (Å)");
  const scale = HBAR2_OVER_M / (distance * distance);
  return {
    "ssσ": HARRISON_ETA["ssσ"] * scale,
    "spσ": HARRISON_ETA["spσ"] * scale,
    "ppσ": HARRISON_ETA["ppσ"] * scale,
    "ppπ": HARRISON_ETA["ppπ"] * scale,
  };
}

const isHarrisonType = (bond: BondType): bond is HarrisonBondType => bond in HARRISON_ETA;

/**
 * A copy of the model's document with every Slater–Koster hopping integral of type ssσ, spσ, ppσ, ppπ set
 * to Harrison's universal value at its shell's bond length; other parameters are untouched.
 */
export function withHarrisonStartingValues(compiled: CompiledModel): ModelDocument {
  const values = new Map<string, number>();
  for (const origin of compiled.bondIntegrals)
    if (origin.integral.matrix === "hamiltonian" && isHarrisonType(origin.type))
      values.set(origin.parameter, harrisonBondIntegrals(origin.distance)[origin.type]);
  return {
    ...compiled.document,
    parameters: compiled.document.parameters.map((p) => (values.has(p.name) ? { ...p, value: values.get(p.name)! } : p)),
  };
}
