import { z } from "zod";
import { energyUnits } from "@/lib/units";
import { MAX_HEADER_CELLS, groupDigits } from "./limits";

/** How the columns of an uploaded band file map onto points: the one schema shared by form, route and tests. */

const columnName = z.string().trim().min(1, "a column name is needed");
const finite = z.number().refine(Number.isFinite, "must be a finite number");
const vec3 = z.tuple([finite, finite, finite]);

export const kKinds = ["reduced", "cartesian", "twoPiOverA", "path"] as const;
export type KKind = (typeof kKinds)[number];

/** A labelled k-point (vertex of a k-path, or a point to mark as an axis tick). */
export const labelledKPointSchema = z.object({
  label: z.string().trim().min(1, "a label is needed (e.g. Γ, X, L)"),
  /** 1–3 components: reduced coordinates, or Cartesian 1/Å (2π included); missing components are 0. */
  k: z.array(finite).min(1, "give 1 to 3 components").max(3, "give 1 to 3 components"),
  coordinates: z.enum(["reduced", "cartesian"]),
});
export type LabelledKPoint = z.infer<typeof labelledKPointSchema>;

export const kMappingSchema = z.object({
  kind: z.enum(kKinds),
  /** k-component columns for reduced, cartesian and twoPiOverA (1–3, in order). */
  columns: z.array(columnName).min(1, "name 1 to 3 k columns").max(3, "name 1 to 3 k columns").optional(),
  /** Path-distance column for kind "path". */
  column: columnName.optional(),
  /** Real-space lattice vectors in Å (1–3); for reduced k, and for a path with reduced vertices. */
  lattice: z.array(vec3).min(1, "give 1 to 3 lattice vectors").max(3, "give 1 to 3 lattice vectors").optional(),
  /** Lattice constant a in Å, for k in units of 2π/a. */
  latticeConstant: z.number().positive("the lattice constant must be positive (Å)").optional(),
  /** The labelled vertices of the path (kind "path"), or labelled points to mark as ticks (other kinds). */
  path: z.array(labelledKPointSchema).optional(),
});

export const datasetMappingSchema = z
  .object({
    name: z.string().trim().min(1, "a dataset needs a name").max(200, "at most 200 characters"),
    description: z.string().max(5000, "at most 5000 characters").optional(),
    source: z.enum(["calculation", "photoemission"]),
    /** Free-text note on the energy zero, e.g. "Fermi level" or "valence-band maximum". */
    energyReference: z.string().trim().max(200, "at most 200 characters").optional(),
    format: z.enum(["long", "wide"]),
    delimiter: z.enum(["auto", ",", "\t", ";", "whitespace"]).default("auto"),
    k: kMappingSchema,
    band: z.object({ column: columnName }).optional(),
    energy: z.object({
      column: columnName.optional(),
      columns: z
        .array(columnName)
        .min(1, "name one energy column per band")
        // A wide file needs one k column besides its energies, within the header's cell limit.
        .max(MAX_HEADER_CELLS - 1, `at most ${groupDigits(MAX_HEADER_CELLS - 1)} energy columns (a header holds at most ${groupDigits(MAX_HEADER_CELLS)} cells)`)
        .optional(),
      unit: z.enum(energyUnits),
    }),
    /** Uncertainty σ of each energy; its unit defaults to the energy unit. */
    sigma: z.object({ column: columnName, unit: z.enum(energyUnits).optional() }).optional(),
    /** Non-negative user weight of each point. */
    weight: z.object({ column: columnName }).optional(),
    /** Branch or cut label of each point. */
    label: z.object({ column: columnName }).optional(),
  })
  .superRefine((m, ctx) => {
    const fail = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });

    if (m.format === "wide") {
      if (!m.energy.columns) fail(["energy", "columns"], "wide format needs one energy column per band");
      if (m.energy.column) fail(["energy", "column"], "wide format uses energy.columns, not energy.column");
      if (m.band) fail(["band"], "wide format takes the band from the column order; leave band out");
    } else {
      if (!m.band) fail(["band", "column"], "long format needs a band column");
      if (!m.energy.column) fail(["energy", "column"], "long format needs an energy column");
      if (m.energy.columns) fail(["energy", "columns"], "long format uses energy.column, not energy.columns");
    }

    const k = m.k;
    if (k.kind === "path") {
      if (!k.column) fail(["k", "column"], "a path-distance k needs the distance column");
      if (k.columns) fail(["k", "columns"], "a path-distance k takes one distance column (k.column), not k.columns");
      if (!k.path || k.path.length < 2) fail(["k", "path"], "a path-distance k needs at least two labelled points");
    } else {
      if (!k.columns) fail(["k", "columns"], "name 1 to 3 k columns");
      if (k.column) fail(["k", "column"], "k.column is the distance column of kind path only");
    }
    if (k.kind === "reduced") {
      if (!k.lattice) fail(["k", "lattice"], "reduced k needs the lattice vectors (Å)");
      else if (k.columns && k.columns.length > k.lattice.length)
        fail(["k", "columns"], `${k.columns.length} reduced k columns but only ${k.lattice.length} lattice vectors`);
    }
    if (k.kind === "twoPiOverA" && k.latticeConstant === undefined)
      fail(["k", "latticeConstant"], "k in units of 2π/a needs the lattice constant a (Å)");
    k.path?.forEach((p, i) => {
      if (p.coordinates !== "reduced") return;
      if (!k.lattice) fail(["k", "path", i, "coordinates"], "a labelled point in reduced coordinates needs the lattice");
      else if (p.k.length > k.lattice.length)
        fail(["k", "path", i, "k"], `${p.k.length} reduced components but only ${k.lattice.length} lattice vectors`);
    });

    // One column, one role: a column mapped twice is almost always a slip in the form.
    const uses = new Map<string, string[]>();
    const use = (column: string | undefined, role: string) => {
      if (column) uses.set(column, [...(uses.get(column) ?? []), role]);
    };
    k.columns?.forEach((c) => use(c, "k"));
    use(k.column, "path distance");
    use(m.band?.column, "band");
    use(m.energy.column, "energy");
    m.energy.columns?.forEach((c) => use(c, "energy"));
    use(m.sigma?.column, "σ");
    use(m.weight?.column, "weight");
    use(m.label?.column, "label");
    for (const [column, roles] of uses)
      if (roles.length > 1) fail(["columns"], `column “${column}” is mapped more than once (${roles.join(", ")})`);
  });

/** A validated mapping (defaults applied). */
export type DatasetMapping = z.output<typeof datasetMappingSchema>;
/** A mapping as written by a user or a script (defaults optional). */
export type DatasetMappingInput = z.input<typeof datasetMappingSchema>;

export type MappingParseResult =
  | { ok: true; mapping: DatasetMapping }
  | { ok: false; fieldErrors: Record<string, string[]> };

/**
 * Validates a mapping JSON and returns every field error, keyed by dotted path (`"k.lattice"`, `"energy.unit"`).
 * @param input - the untrusted mapping (parsed JSON)
 */
export function parseDatasetMapping(input: unknown): MappingParseResult {
  const result = datasetMappingSchema.safeParse(input);
  if (result.success) return { ok: true, mapping: result.data };
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.map(String).join(".") || "(mapping)";
    (fieldErrors[key] ??= []).push(issue.message);
  }
  return { ok: false, fieldErrors };
}
