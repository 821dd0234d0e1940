import type { Vec3 } from "../geometry/vec3";
import type { HoppingEntry, KPathPoint, ModelDocument, ModelParameter, ModelSite } from "../model/schema";

/** The geometry a template is built on: the template's defaults or the user's own cell. */
export interface TemplateGeometry {
  /** lattice vectors, Cartesian Å */
  lattice: Vec3[];
  /** sites with fractional positions */
  sites: ModelSite[];
  /** template option: include overlap S(k) where the template supports it */
  overlap: boolean;
}

/** What a template definition contributes to a document. */
export interface TemplateBody {
  parameters: ModelParameter[];
  slaterKoster?: ModelDocument["slaterKoster"];
  hoppings?: HoppingEntry[];
  overlaps?: HoppingEntry[];
}

export interface TemplateDefinition {
  id: string;
  title: string;
  description: string;
  dimension: 1 | 2 | 3;
  /** published source of the default values (or a statement that they are illustrative) */
  source: string;
  /** default lattice constant, Å, and its meaning */
  latticeConstant: { value: number; meaning: string };
  /** lattice vectors for a lattice constant a (Å) */
  lattice(a: number): Vec3[];
  sites: ModelSite[];
  /** supports the `overlap` option */
  supportsOverlap: boolean;
  /** standard k-path, reduced coordinates of the template's reciprocal vectors */
  kPath: KPathPoint[];
  body(geometry: TemplateGeometry): TemplateBody;
}

/** A parameter declaration with the usual defaults (free unless stated, no bounds unless given). */
export function parameter(
  name: string,
  value: number,
  description: string,
  options: { unit?: "eV" | "1"; free?: boolean; min?: number } = {},
): ModelParameter {
  return {
    name,
    value,
    unit: options.unit ?? "eV",
    free: options.free ?? true,
    description,
    ...(options.min !== undefined ? { min: options.min } : {}),
  };
}
