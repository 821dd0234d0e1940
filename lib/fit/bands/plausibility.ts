import type { FittedParameter } from "../least-squares";
import type { BandFitWarning } from "./schema";

/**
 * How far beyond the data's energy scale a fitted energy parameter may lie before it counts as having
 * run away (common practice: tight-binding on-site energies and bond integrals are of the order of the
 * band width they describe; ten times the whole energy range of the data is far outside that).
 */
export const RUNAWAY_FACTOR = 10;

/** What the checks need about one fitted parameter. */
export interface PlausibilityInput {
  parameter: FittedParameter;
  unit: "eV" | "1";
  /** true for an overlap integral of the model (dimensionless, |s| < 1); false for the renormalisation factor */
  isOverlap: boolean;
}

/**
 * The energy scale of the data, eV: the larger of the energy range of the points used and their largest
 * |E| (on-site energies follow the data's energy zero, bond integrals its range).
 * @param energies - data energies of the points used, eV
 */
export function dataEnergyScale(energies: readonly number[]): number {
  let low = Infinity;
  let high = -Infinity;
  let largest = 0;
  for (const e of energies) {
    low = Math.min(low, e);
    high = Math.max(high, e);
    largest = Math.max(largest, Math.abs(e));
  }
  return energies.length === 0 ? 0 : Math.max(high - low, largest);
}

/**
 * Warnings (kind "undetermined") for free parameters whose fitted value is not a result although the local
 * statistics may look fine: a value that ran away beyond any physical scale of the data (|θ| > 10 × the
 * data's energy scale for an energy; |s| ≥ 1 for an overlap integral of normalised orbitals, by the
 * Cauchy–Schwarz inequality), or a standard error larger than that scale (the data constrain the value
 * only to within more than their whole energy range; for a dimensionless parameter, more than 1).
 * @param scale - the data's energy scale, eV ({@link dataEnergyScale})
 */
export function implausibleParameterWarnings(parameters: readonly PlausibilityInput[], scale: number): BandFitWarning[] {
  const warnings: BandFitWarning[] = [];
  if (!(scale > 0)) return warnings;
  for (const { parameter: p, unit, isOverlap } of parameters) {
    if (!p.free) continue;
    const limit = unit === "eV" ? RUNAWAY_FACTOR * scale : isOverlap ? 1 : Infinity;
    const errorLimit = unit === "eV" ? scale : 1;
    const unitText = unit === "eV" ? " eV" : "";
    if (Math.abs(p.value) >= limit)
      warnings.push({
        kind: "undetermined",
        parameters: [p.name],
        message:
          unit === "eV"
            ? `${p.name} ran away to ${p.value.toPrecision(4)} eV, over ${RUNAWAY_FACTOR} times the data's energy scale ` +
              `(${scale.toFixed(2)} eV): the data do not determine it (typically only a combination with another parameter); fix it or bound it`
            : `${p.name} = ${p.value.toPrecision(4)}: an overlap of normalised orbitals is below 1 in magnitude, so the data do not determine it`,
      });
    else if (p.standardError !== null && p.standardError > errorLimit)
      warnings.push({
        kind: "undetermined",
        parameters: [p.name],
        message:
          `${p.name} = ${p.value.toPrecision(4)}${unitText} has a standard error of ${p.standardError.toPrecision(3)}${unitText}, ` +
          (unit === "eV" ? `more than the data's whole energy scale (${scale.toFixed(2)} eV)` : "more than 1") +
          ": the data do not determine it",
      });
  }
  return warnings;
}
