import type { z } from "zod";
import { completeLattice, reciprocalLattice } from "../geometry/lattice";
import { type Translation, coincidentSites, findNeighbourShells } from "../geometry/shells";
import { type Vec3, add, combine, scale } from "../geometry/vec3";
import { type BondType, bondTypesBetween, splitBondType } from "../slater-koster/bond-types";
import { slaterKosterElement } from "../slater-koster/table";
import { type ModelIssue, ModelError } from "./errors";
import { SHELL_ORDER, type OrbitalName, orbitalShell } from "./orbitals";
import { type BondIntegralKey, type ModelMatrix, bondIntegralName, onsiteParameterName } from "./parameter-names";
import { type HoppingEntry, type ModelDocument, type ModelParameter, modelDocumentSchema } from "./schema";

/** One orbital of the basis, in basis order (sites in document order, orbitals in site order). */
export interface CompiledOrbital {
  readonly index: number;
  readonly site: string;
  readonly siteIndex: number;
  readonly species: string;
  readonly orbital: OrbitalName;
  /** "site:orbital", e.g. "A:pz" */
  readonly label: string;
  /** τ, Cartesian Å */
  readonly position: Vec3;
}

export type { ModelMatrix } from "./parameter-names";

/**
 * One linear term of H(k) or S(k): M_from,to(k) += θ_parameter × (re + i·im) × e^{ik·bond}. Every term's
 * Hermitian partner is itself a term, so the list alone builds a Hermitian matrix.
 */
export interface ModelTerm {
  readonly matrix: ModelMatrix;
  readonly from: number;
  readonly to: number;
  readonly translation: Translation;
  /** R + τ_to − τ_from, Cartesian Å */
  readonly bond: Vec3;
  readonly parameter: number;
  readonly re: number;
  readonly im: number;
}

/** Where a generated Slater–Koster parameter comes from (for starting-value helpers, display and export). */
export interface BondIntegralOrigin {
  readonly parameter: string;
  /** the parameter's name as structured fields (matrix, shell pair, kind, species pair, shell) */
  readonly integral: BondIntegralKey;
  readonly type: BondType;
  /** bond length, Å */
  readonly distance: number;
}

/** A validated model ready for H(k): basis, parameters in a fixed order, and linear terms. */
export interface CompiledModel {
  readonly document: ModelDocument;
  readonly dimension: 1 | 2 | 3;
  /** lattice vectors, Cartesian Å (as many as the dimension) */
  readonly lattice: Vec3[];
  /** reciprocal vectors b_i, 1/Å (2π included) */
  readonly reciprocal: Vec3[];
  readonly orbitals: CompiledOrbital[];
  readonly orbitalCount: number;
  /** parameters in document order: the order of every θ vector */
  readonly parameters: ModelParameter[];
  readonly parameterIndex: ReadonlyMap<string, number>;
  /** each parameter's matrix (hamiltonian: eV; overlap: dimensionless) */
  readonly parameterMatrix: ModelMatrix[];
  /** the document's parameter values as a θ vector */
  readonly initialValues: Float64Array;
  readonly hasOverlap: boolean;
  readonly terms: ModelTerm[];
  readonly bondIntegrals: BondIntegralOrigin[];
  /** Slater–Koster shell distances, Å (empty without a Slater–Koster section) */
  readonly shellDistances: number[];
}

interface PendingTerm {
  matrix: ModelMatrix;
  from: number;
  to: number;
  translation: Translation;
  parameterName: string;
  re: number;
  im: number;
  path: string;
}

const COEFFICIENT_CUTOFF = 1e-12;

/**
 * Validates a model document (schema, then meaning) and compiles it into linear terms.
 * Convention: H_ij(k) = Σ_R t_ij(R) e^{ik·(R + τ_j − τ_i)} — the phase uses the full bond vector.
 * @param input - a model document (parsed JSON); defaults are filled in by the schema
 * @throws ModelError listing every problem with its path in the document
 */
export function compileModel(input: unknown): CompiledModel {
  const parsed = modelDocumentSchema.safeParse(input);
  if (!parsed.success) throw new ModelError(zodIssues(parsed.error));
  const doc = parsed.data;
  const issues: ModelIssue[] = [];

  const dimension = doc.lattice.length as 1 | 2 | 3;
  let reciprocal: Vec3[] = [];
  try {
    reciprocal = reciprocalLattice(doc.lattice);
  } catch (error) {
    throw new ModelError([{ path: "lattice", message: (error as Error).message }]);
  }
  const full = completeLattice(doc.lattice);

  const orbitals = buildBasis(doc, full, issues);
  const orbitalByLabel = new Map(orbitals.map((o) => [o.label, o.index]));
  for (const [i, j] of coincidentSites(doc.lattice, doc.sites.map((s) => s.position)))
    issues.push({ path: `sites.${j}.position`, message: `sites ${doc.sites[i].label} and ${doc.sites[j].label} coincide: zero-length bond` });

  const resolve = (reference: string, path: string): number | undefined => {
    const index = orbitalByLabel.get(reference);
    if (index === undefined) {
      const [siteLabel] = reference.split(":");
      const site = doc.sites.find((s) => s.label === siteLabel);
      issues.push({
        path,
        message: site
          ? `unknown orbital "${reference}": site ${siteLabel} has ${site.orbitals.join(", ")}`
          : `unknown orbital "${reference}": there is no site "${siteLabel}"`,
      });
    }
    return index;
  };

  const pending: PendingTerm[] = [];
  addOnsiteTerms(doc, orbitals, resolve, pending, issues);
  const skResult = doc.slaterKoster ? addSlaterKosterTerms(doc, orbitals, pending) : { origins: [], distances: [] };
  addExplicitTerms(doc, "hamiltonian", doc.hoppings, "hoppings", dimension, resolve, pending, issues);
  addExplicitTerms(doc, "overlap", doc.overlaps, "overlaps", dimension, resolve, pending, issues);

  const parameterIndex = new Map<string, number>();
  doc.parameters.forEach((p, i) => {
    if (parameterIndex.has(p.name)) issues.push({ path: `parameters.${i}.name`, message: `parameter "${p.name}" is declared twice` });
    else parameterIndex.set(p.name, i);
    if (p.min !== undefined && p.max !== undefined && p.min > p.max)
      issues.push({ path: `parameters.${i}`, message: `parameter "${p.name}": min ${p.min} is above max ${p.max}` });
    if ((p.min !== undefined && p.value < p.min) || (p.max !== undefined && p.value > p.max))
      issues.push({ path: `parameters.${i}.value`, message: `parameter "${p.name}": value ${p.value} is outside its bounds` });
  });

  const parameterMatrix: (ModelMatrix | undefined)[] = doc.parameters.map(() => undefined);
  const missingReported = new Set<string>();
  const terms: ModelTerm[] = [];
  for (const t of pending) {
    const index = parameterIndex.get(t.parameterName);
    if (index === undefined) {
      if (!missingReported.has(t.parameterName))
        issues.push({ path: t.path, message: `missing parameter "${t.parameterName}": declare it in parameters` });
      missingReported.add(t.parameterName);
      continue;
    }
    const seen = parameterMatrix[index];
    if (seen && seen !== t.matrix)
      issues.push({ path: t.path, message: `parameter "${t.parameterName}" is used in both H and S` });
    parameterMatrix[index] = t.matrix;
    const bond = add(combine(t.translation, full), sub3(orbitals[t.to].position, orbitals[t.from].position));
    terms.push({ matrix: t.matrix, from: t.from, to: t.to, translation: t.translation, bond, parameter: index, re: t.re, im: t.im });
  }
  doc.parameters.forEach((p, i) => {
    const matrix = parameterMatrix[i];
    if (!matrix) issues.push({ path: `parameters.${i}`, message: `parameter "${p.name}" is not used by any term` });
    else if (matrix === "hamiltonian" && p.unit !== "eV")
      issues.push({ path: `parameters.${i}.unit`, message: `parameter "${p.name}" enters H and must be in eV` });
    else if (matrix === "overlap" && p.unit !== "1")
      issues.push({ path: `parameters.${i}.unit`, message: `parameter "${p.name}" enters S and is dimensionless (unit "1")` });
  });

  if (issues.length > 0) throw new ModelError(issues);
  return {
    document: doc,
    dimension,
    lattice: doc.lattice.map((a) => [...a] as Vec3),
    reciprocal,
    orbitals,
    orbitalCount: orbitals.length,
    parameters: doc.parameters,
    parameterIndex,
    parameterMatrix: parameterMatrix as ModelMatrix[],
    initialValues: Float64Array.from(doc.parameters.map((p) => p.value)),
    hasOverlap: terms.some((t) => t.matrix === "overlap"),
    terms,
    bondIntegrals: skResult.origins.filter((o) => parameterIndex.has(o.parameter)),
    shellDistances: skResult.distances,
  };
}

const sub3 = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];

function zodIssues(error: z.ZodError): ModelIssue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message }));
}

function buildBasis(doc: ModelDocument, full: [Vec3, Vec3, Vec3], issues: ModelIssue[]): CompiledOrbital[] {
  const orbitals: CompiledOrbital[] = [];
  const labels = new Set<string>();
  doc.sites.forEach((site, siteIndex) => {
    if (labels.has(site.label)) issues.push({ path: `sites.${siteIndex}.label`, message: `site label "${site.label}" is used twice` });
    labels.add(site.label);
    const position = combine(site.position, full);
    const seen = new Set<OrbitalName>();
    site.orbitals.forEach((orbital, k) => {
      if (seen.has(orbital))
        issues.push({ path: `sites.${siteIndex}.orbitals.${k}`, message: `orbital ${orbital} is listed twice on site ${site.label}` });
      seen.add(orbital);
      orbitals.push({
        index: orbitals.length,
        site: site.label,
        siteIndex,
        species: site.species,
        orbital,
        label: `${site.label}:${orbital}`,
        position,
      });
    });
  });
  return orbitals;
}

function addOnsiteTerms(
  doc: ModelDocument,
  orbitals: CompiledOrbital[],
  resolve: (reference: string, path: string) => number | undefined,
  pending: PendingTerm[],
  issues: ModelIssue[],
): void {
  const overrides = new Map<number, string | null>();
  doc.onsite.forEach((entry, k) => {
    const index = resolve(entry.orbital, `onsite.${k}.orbital`);
    if (index === undefined) return;
    if (overrides.has(index)) issues.push({ path: `onsite.${k}`, message: `on-site energy of ${entry.orbital} is set twice` });
    overrides.set(index, entry.parameter);
  });
  for (const o of orbitals) {
    const name = overrides.has(o.index) ? overrides.get(o.index)! : onsiteParameterName(orbitalShell(o.orbital), o.species);
    if (name === null) continue;
    pending.push({
      matrix: "hamiltonian",
      from: o.index,
      to: o.index,
      translation: [0, 0, 0],
      parameterName: name,
      re: 1,
      im: 0,
      path: `onsite (${o.label})`,
    });
  }
}

function addSlaterKosterTerms(doc: ModelDocument, orbitals: CompiledOrbital[], pending: PendingTerm[]) {
  const settings = doc.slaterKoster!;
  const shells = findNeighbourShells(doc.lattice, doc.sites.map((s) => s.position), {
    maxShell: settings.maxShell,
    tolerance: settings.tolerance,
  });
  const bySite = doc.sites.map((_, i) => orbitals.filter((o) => o.siteIndex === i));
  const origins = new Map<string, BondIntegralOrigin>();
  const matrices: ModelMatrix[] = settings.overlap ? ["hamiltonian", "overlap"] : ["hamiltonian"];
  for (const bond of shells.bonds) {
    const direction = scale(bond.vector, 1 / bond.distance);
    for (const a of bySite[bond.from])
      for (const b of bySite[bond.to]) {
        const ascending = SHELL_ORDER[orbitalShell(a.orbital)] <= SHELL_ORDER[orbitalShell(b.orbital)];
        const [low, high] = ascending ? [a, b] : [b, a];
        const sameShell = orbitalShell(low.orbital) === orbitalShell(high.orbital);
        const species: [string, string] = sameShell
          ? ([low.species, high.species].sort() as [string, string])
          : [low.species, high.species];
        for (const type of bondTypesBetween(orbitalShell(low.orbital), orbitalShell(high.orbital))) {
          const coefficient = slaterKosterElement(a.orbital, b.orbital, direction, (t) => (t === type ? 1 : 0));
          if (Math.abs(coefficient) < COEFFICIENT_CUTOFF) continue;
          for (const matrix of matrices) {
            const integral: BondIntegralKey = { matrix, ...splitBondType(type), pair: species, shell: bond.shell };
            const name = bondIntegralName(integral);
            if (!origins.has(name)) origins.set(name, { parameter: name, integral, type, distance: bond.distance });
            pending.push({
              matrix,
              from: a.index,
              to: b.index,
              translation: bond.translation,
              parameterName: name,
              re: coefficient,
              im: 0,
              path: `slaterKoster (${a.label}→${b.label}, shell ${bond.shell})`,
            });
          }
        }
      }
  }
  return { origins: [...origins.values()], distances: shells.distances };
}

function addExplicitTerms(
  doc: ModelDocument,
  matrix: ModelMatrix,
  entries: HoppingEntry[],
  section: "hoppings" | "overlaps",
  dimension: number,
  resolve: (reference: string, path: string) => number | undefined,
  pending: PendingTerm[],
  issues: ModelIssue[],
): void {
  type Resolved = { k: number; from: number; to: number; translation: Translation; re: number; im: number; parameter: string };
  const resolved: Resolved[] = [];
  entries.forEach((entry, k) => {
    const path = `${section}.${k}`;
    const from = resolve(entry.from, `${path}.from`);
    const to = resolve(entry.to, `${path}.to`);
    if (entry.translation.some((n, axis) => axis >= dimension && n !== 0)) {
      issues.push({ path: `${path}.translation`, message: `a ${dimension}D lattice has no translation along a${dimension + 1}` });
      return;
    }
    if (from === undefined || to === undefined) return;
    const [re, im] = typeof entry.factor === "number" ? [entry.factor, 0] : entry.factor;
    if (from === to && entry.translation.every((n) => n === 0)) {
      issues.push({
        path,
        message: `${entry.from} to itself in the home cell is an on-site term (zero-length bond): use "onsite" instead`,
      });
      return;
    }
    resolved.push({ k, from, to, translation: entry.translation, re, im, parameter: entry.parameter });
  });

  const key = (from: number, to: number, t: Translation) => `${from}|${to}|${t.join(",")}`;
  const byKey = new Map<string, Resolved[]>();
  for (const r of resolved) byKey.set(key(r.from, r.to, r.translation), [...(byKey.get(key(r.from, r.to, r.translation)) ?? []), r]);
  const describe = (r: Resolved) => `${entries[r.k].from} → ${entries[r.k].to} at R = [${r.translation.join(", ")}]`;
  const isConjugate = (a: Resolved, b: Resolved) =>
    a.parameter === b.parameter && Math.abs(a.re - b.re) < 1e-12 && Math.abs(a.im + b.im) < 1e-12;

  for (const r of resolved) {
    const path = `${section}.${r.k}`;
    const negated = r.translation.map((n) => -n || 0) as Translation;
    const partners = (byKey.get(key(r.to, r.from, negated)) ?? []).filter((p) => p !== r);
    if (doc.partners === "automatic") {
      const earlier = partners.find((p) => p.k < r.k);
      if (earlier) {
        issues.push({
          path,
          message: isConjugate(r, earlier)
            ? `${describe(r)} is the Hermitian partner of ${section}.${earlier.k}, which is added automatically: remove one`
            : `non-Hermitian input: ${describe(r)} and ${section}.${earlier.k} are each other's partners but not complex conjugates`,
        });
        continue;
      }
      pending.push({ matrix, from: r.from, to: r.to, translation: r.translation, parameterName: r.parameter, re: r.re, im: r.im, path });
      pending.push({ matrix, from: r.to, to: r.from, translation: negated, parameterName: r.parameter, re: r.re, im: -r.im, path });
    } else {
      if (partners.length === 0) {
        issues.push({ path, message: `${describe(r)} has no Hermitian partner (${entries[r.k].to} → ${entries[r.k].from} at −R)` });
        continue;
      }
      if (!partners.some((p) => isConjugate(r, p))) {
        issues.push({ path, message: `non-Hermitian input: the partner of ${describe(r)} is not its complex conjugate` });
        continue;
      }
      pending.push({ matrix, from: r.from, to: r.to, translation: r.translation, parameterName: r.parameter, re: r.re, im: r.im, path });
    }
  }
}
