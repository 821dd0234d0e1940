import { ENERGY_ALIGNMENT_FORMULA, ENERGY_OFFSET, RENORMALISATION, revisionAlignment } from "@/lib/fit/bands/energy-alignment";
import type { BandMapping, EnergyWindow, FitOptions } from "@/lib/fit/bands/schema";
import type { StoredResult } from "@/lib/fit/bands/stored-result";
import {
  type CompiledModel,
  type RealSpaceContribution,
  type RealSpaceElement,
  type Vec3,
  compileModel,
  expandHoppings,
  kPathVertices,
  norm,
} from "@/lib/tb";
import { CONVENTIONS, ORBITAL_DEFINITIONS } from "./conventions";
import { type ParameterSet, type ParameterSetBond, parameterSetSchema } from "./parameter-set-schema";

/** The settings a revision ran with (its stored snapshot). */
export interface ParameterSetSettings {
  mapping: BandMapping;
  window: EnergyWindow | null;
  options: FitOptions;
}

/** Where an export came from (the routes fill it from the revision and its dataset). */
export interface ParameterSetProvenance {
  dataset: {
    id: string;
    name: string;
    sha256: string;
    source: "calculation" | "photoemission";
    /** what the data's energies are measured from, as the dataset states it; null when it does not */
    energyReference: string | null;
  };
  fit: { id: string; name: string };
  revision: number;
  launchedBy: string | null;
  launchedAt: Date;
  finishedAt: Date | null;
  exportedAt: Date;
  /** package.json's version */
  softwareVersion: string;
}

/** A number when the imaginary part is zero, else [real, imaginary] (the model document's factor convention). */
const complexValue = (re: number, im: number): number | [number, number] => (im === 0 ? re : [re, im]);

const keyOf = (compiled: CompiledModel, from: number, to: number, translation: readonly number[]) =>
  `${compiled.orbitals[from].label}→${compiled.orbitals[to].label}@${translation.join(",")}`;

function contributions(compiled: CompiledModel, list: readonly RealSpaceContribution[]) {
  return list.map((c) => ({ name: compiled.parameters[c.parameter].name, coefficient: complexValue(c.re, c.im) }));
}

function bondEntry(compiled: CompiledModel, e: RealSpaceElement): ParameterSetBond {
  return {
    key: keyOf(compiled, e.from, e.to, e.translation),
    from: compiled.orbitals[e.from].label,
    to: compiled.orbitals[e.to].label,
    matrixEntry: [e.from, e.to],
    translation: [e.translation[0] || 0, e.translation[1] || 0, e.translation[2] || 0], // no −0
    vector: [e.bond[0], e.bond[1], e.bond[2]],
    length: norm(e.bond),
    value: complexValue(e.value, e.imaginary),
    parameters: contributions(compiled, e.contributions),
    partner: keyOf(compiled, e.to, e.from, e.translation.map((n) => -n || 0)),
  };
}

/**
 * Covariance s²(JᵀWJ)⁻¹ of the free parameters from what a result stores: C_ij = r_ij σ_i σ_j, exact since
 * r_ij = C_ij/√(C_ii C_jj) and σ_i = √C_ii (GSL reference manual, "Nonlinear Least-Squares Fitting:
 * Covariance matrix of best fit parameters"); null wherever a parameter is not determined.
 */
function covarianceOf(result: StoredResult): ParameterSet["covariance"] {
  const { names, matrix } = result.correlation;
  const error = names.map((name) => result.parameters.find((p) => p.name === name)?.standardError ?? null);
  return {
    parameters: names,
    matrix: matrix.map((row, i) =>
      row.map((r, j) => {
        const si = error[i];
        const sj = error[j];
        return r === null || si === null || sj === null ? null : r * si * sj;
      }),
    ),
    correlation: matrix,
  };
}

function globalParameter(result: StoredResult, name: string, value: number, free: boolean) {
  return { value, free, standardError: result.parameters.find((p) => p.name === name)?.standardError ?? null };
}

function kPathOf(compiled: CompiledModel): ParameterSet["kPath"] {
  const path = compiled.document.kPath;
  if (!path || path.length < 2) return null;
  const vertices = kPathVertices(compiled.document);
  return path.map((p, i) => ({ label: p.label, reduced: [...p.reduced] as Vec3, cartesian: [...vertices[i].k] as Vec3, jump: p.jump ?? false }));
}

/**
 * Builds the parameter set of a finished revision from its fitted model (the bond lists come from
 * `expandHoppings` at the fitted values), its settings and its provenance, and validates it.
 * @param result - the revision's stored result, in today's parameter names (`readStoredResult`)
 * @param settings - the revision's mapping, window and options
 */
export function buildParameterSet(result: StoredResult, settings: ParameterSetSettings, provenance: ParameterSetProvenance): ParameterSet {
  const compiled = compileModel(result.fittedModel);
  const realSpace = expandHoppings(compiled, compiled.initialValues);
  const byName = new Map(result.parameters.map((p) => [p.name, p]));
  const alignment = revisionAlignment(result.parameters, settings.options);
  const { options } = settings;
  const usedOrbitals = [...new Set(compiled.orbitals.map((o) => o.orbital))];
  const document: ParameterSet = {
    format: "bandwright-parameter-set",
    version: 2,
    units: { energy: "eV", length: "Å", wavevector: "1/Å, 2π included" },
    conventions: { ...CONVENTIONS },
    spin: "spinless",
    lattice: compiled.lattice.map((v) => [v[0], v[1], v[2]]),
    reciprocalLattice: compiled.reciprocal.map((v) => [v[0], v[1], v[2]]),
    sites: compiled.document.sites.map((s) => ({ label: s.label, species: s.species, position: [...s.position], orbitals: [...s.orbitals] })),
    orbitals: compiled.orbitals.map((o) => ({
      index: o.index,
      label: o.label,
      site: o.site,
      species: o.species,
      orbital: o.orbital,
      position: [...o.position],
      onsite: { value: realSpace.onsite[o.index], parameters: contributions(compiled, realSpace.onsiteContributions[o.index]) },
    })),
    orbitalDefinitions: Object.fromEntries(usedOrbitals.map((o) => [o, ORBITAL_DEFINITIONS[o]])),
    parameters: compiled.parameters.map((p) => {
      const fitted = byName.get(p.name);
      return {
        name: p.name,
        value: p.value,
        unit: p.unit,
        standardError: fitted?.standardError ?? null,
        free: p.free,
        determined: fitted?.determined ?? !p.free,
        integral: p.integral ?? null,
        description: p.description ?? null,
      };
    }),
    covariance: covarianceOf(result),
    energyAlignment: {
      formula: ENERGY_ALIGNMENT_FORMULA,
      offset: globalParameter(result, ENERGY_OFFSET, alignment.offset, options.energyOffset.free),
      renormalisation: globalParameter(result, RENORMALISATION, alignment.renormalisation, options.renormalisation.free),
      reference: alignment.reference,
      dataEnergyZero: provenance.dataset.energyReference ?? "unstated",
    },
    bonds: realSpace.hoppings.map((e) => bondEntry(compiled, e)),
    overlaps: realSpace.overlaps.map((e) => bondEntry(compiled, e)),
    kPath: kPathOf(compiled),
    fit: {
      mapping: settings.mapping,
      window: settings.window,
      sigma: { policy: options.sigma, uniform: options.uniformSigma },
      bandWeights: options.bandWeights ?? {},
      starts: options.starts,
      seed: options.seed,
      maxIterations: options.maxIterations,
      timeLimitMs: options.timeLimitMs,
      jacobian: options.jacobian,
      harrisonStart: options.harrisonStart,
      // the result says what the fit used; one stored before crossings were treated has none
      crossingTolerance: result.crossings?.tolerance ?? null,
    },
    statistics: {
      rms: result.rms,
      maxAbsResidual: result.maxAbsResidual,
      chiSquared: result.chiSquared,
      reducedChiSquared: result.reducedChiSquared,
      pointsUsed: result.pointsUsed,
      pointsDropped: { ...result.pointsDropped },
      crossingPoints: result.crossings?.points ?? null,
      converged: result.converged,
      stopReason: result.stopReason,
    },
    provenance: {
      dataset: { id: provenance.dataset.id, name: provenance.dataset.name, sha256: provenance.dataset.sha256, source: provenance.dataset.source },
      fit: provenance.fit,
      revision: provenance.revision,
      launchedBy: provenance.launchedBy,
      launchedAt: provenance.launchedAt.toISOString(),
      finishedAt: provenance.finishedAt?.toISOString() ?? null,
      exportedAt: provenance.exportedAt.toISOString(),
      software: { name: "bandwright", version: provenance.softwareVersion },
    },
  };
  return parameterSetSchema.parse(document);
}
