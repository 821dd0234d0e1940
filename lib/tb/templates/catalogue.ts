import { reciprocalLattice, reducedToCartesian } from "../geometry/lattice";
import { type KPath, type KPathDensity, type KPathVertex, buildKPath } from "../geometry/kpath";
import type { Vec3 } from "../geometry/vec3";
import { compileModel } from "../model/compile";
import { type ModelIssue, ModelError } from "../model/errors";
import { canonicalParameterName } from "../model/parameter-names";
import type { KPathPoint, ModelDocument, ModelParameter } from "../model/schema";
import { diamondSp3sStar, zincblendeSp3sStar } from "./semiconductors";
import { bccS, chainS, cubicSimpleS, fccS, honeycombPz, squareSingle } from "./simple-lattices";
import { bccSpd, fccSpd } from "./transition-metals";
import type { TemplateDefinition, TemplateGeometry } from "./types";

export const TEMPLATE_IDS = [
  "chain-s",
  "square-single",
  "honeycomb-pz",
  "cubic-s",
  "bcc-s",
  "fcc-s",
  "diamond-sp3s-star",
  "zincblende-sp3s-star",
  "fcc-spd",
  "bcc-spd",
] as const;
export type TemplateId = (typeof TEMPLATE_IDS)[number];

const DEFINITIONS: Record<TemplateId, TemplateDefinition> = {
  "chain-s": chainS,
  "square-single": squareSingle,
  "honeycomb-pz": honeycombPz,
  "cubic-s": cubicSimpleS,
  "bcc-s": bccS,
  "fcc-s": fccS,
  "diamond-sp3s-star": diamondSp3sStar,
  "zincblende-sp3s-star": zincblendeSp3sStar,
  "fcc-spd": fccSpd,
  "bcc-spd": bccSpd,
};

/** What a template offers, for pickers and routes. */
export interface TemplateSummary {
  id: TemplateId;
  title: string;
  description: string;
  dimension: 1 | 2 | 3;
  orbitalCount: number;
  /** default parameters (values at the default lattice constant; distance-scaled ones change with it) */
  parameters: ModelParameter[];
  /** published source of the default values */
  source: string;
  /** default lattice constant, Å, and what it measures */
  latticeConstant: { value: number; meaning: string };
  supportsOverlap: boolean;
  /** standard k-path, reduced coordinates of the template's reciprocal vectors */
  kPath: KPathPoint[];
}

/** Per-parameter overrides of a template's defaults. */
export type ParameterOverrides = Record<string, { value?: number; free?: boolean; min?: number; max?: number }>;

/** Options of {@link buildTemplate}. All lengths in Å. */
export interface TemplateOptions {
  /** lattice constant a, Å (meaning per template: `latticeConstant.meaning`); ignored when `lattice` is given */
  latticeConstant?: number;
  /**
   * The user's own lattice vectors (Cartesian Å), in the template's order, e.g. the cell of the DFT data;
   * the model then lives in that frame. The k-path follows (same reduced coordinates).
   */
  lattice?: Vec3[];
  /** fractional positions of the template's sites in the user's cell, in template order */
  sites?: Vec3[];
  /** include the overlap S(k) (templates with `supportsOverlap` only); default false */
  overlap?: boolean;
  parameters?: ParameterOverrides;
}

/** All templates with their metadata (built at their default lattice constants). */
export function listTemplates(): TemplateSummary[] {
  return TEMPLATE_IDS.map((id) => {
    const d = DEFINITIONS[id];
    const doc = buildTemplate(id);
    return {
      id,
      title: d.title,
      description: d.description,
      dimension: d.dimension,
      orbitalCount: d.sites.reduce((n, s) => n + s.orbitals.length, 0),
      parameters: doc.parameters,
      source: d.source,
      latticeConstant: d.latticeConstant,
      supportsOverlap: d.supportsOverlap,
      kPath: d.kPath,
    };
  });
}

/**
 * Builds a model document from a template, checked by {@link compileModel}.
 * @param id - one of {@link TEMPLATE_IDS}
 * @throws ModelError for an unknown template, unknown parameter name, wrong lattice or sites
 */
export function buildTemplate(id: string, options: TemplateOptions = {}): ModelDocument {
  const definition = (DEFINITIONS as Record<string, TemplateDefinition | undefined>)[id];
  if (!definition)
    throw new ModelError([{ path: "template", message: `unknown template "${id}"; known: ${TEMPLATE_IDS.join(", ")}` }]);
  const issues: ModelIssue[] = [];
  const a = options.latticeConstant ?? definition.latticeConstant.value;
  if (!(a > 0)) issues.push({ path: "latticeConstant", message: "the lattice constant must be positive (Å)" });
  if (options.lattice && options.lattice.length !== definition.dimension)
    issues.push({ path: "lattice", message: `template ${id} needs ${definition.dimension} lattice vectors` });
  if (options.sites && options.sites.length !== definition.sites.length)
    issues.push({ path: "sites", message: `template ${id} has ${definition.sites.length} sites (${definition.sites.map((s) => s.label).join(", ")})` });
  if (options.overlap && !definition.supportsOverlap)
    issues.push({ path: "overlap", message: `template ${id} has no overlap variant` });
  if (issues.length) throw new ModelError(issues);

  const geometry: TemplateGeometry = {
    lattice: options.lattice ?? definition.lattice(a),
    sites: definition.sites.map((s, i) => ({ ...s, position: options.sites?.[i] ?? s.position, orbitals: [...s.orbitals] })),
    overlap: options.overlap ?? false,
  };
  const body = definition.body(geometry);
  const known = new Set(body.parameters.map((p) => p.name));
  // Overrides may name bond integrals in the earlier spelling (V_pp_pi[Si-Si,1]).
  const overrides = new Map(Object.entries(options.parameters ?? {}).map(([name, o]) => [canonicalParameterName(name), { name, o }]));
  for (const [canonical, { name }] of overrides)
    if (!known.has(canonical))
      issues.push({ path: `parameters.${name}`, message: `template ${id} has no parameter "${name}"; it has ${[...known].join(", ")}` });
  if (issues.length) throw new ModelError(issues);

  const parameters = body.parameters.map((p) => {
    const o = overrides.get(p.name)?.o;
    return o ? { ...p, ...Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) } : p;
  });
  const doc: ModelDocument = {
    format: "bandwright-model",
    version: 1,
    name: definition.title,
    description: definition.description,
    lattice: geometry.lattice,
    sites: geometry.sites,
    onsite: [],
    slaterKoster: body.slaterKoster,
    hoppings: body.hoppings ?? [],
    overlaps: body.overlaps ?? [],
    partners: "automatic",
    parameters,
    kPath: definition.kPath,
    template: id,
  };
  // the compiled (parsed) document: defaults and each bond integral's structured key filled in
  return compileModel(doc).document;
}

/**
 * The document's k-path vertices in Cartesian k (1/Å) of the document's own frame: the stored reduced
 * coordinates times the document's reciprocal vectors.
 * @throws ModelError when the document has no k-path
 */
export function kPathVertices(doc: ModelDocument): KPathVertex[] {
  if (!doc.kPath || doc.kPath.length < 2) throw new ModelError([{ path: "kPath", message: "the model has no k-path" }]);
  const reciprocal = reciprocalLattice(doc.lattice);
  return doc.kPath.map((p) => ({ label: p.label, k: reducedToCartesian(p.reduced, reciprocal), jump: p.jump }));
}

/** The document's (template's) k-path sampled at the given density, in the document's Cartesian frame. */
export function templateKPath(doc: ModelDocument, density: KPathDensity): KPath {
  return buildKPath(kPathVertices(doc), density);
}
