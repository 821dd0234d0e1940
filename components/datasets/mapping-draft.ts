import type { ColumnRole, DatasetMappingInput, KKind, SuggestedMapping } from "@/lib/datasets";
import type { EnergyUnit } from "@/lib/units";

/** What the upload form lets a user say about one column. */
export type FormColumnRole = "k" | "pathDistance" | "band" | "energy" | "bandEnergy" | "sigma" | "weight" | "label" | "ignore";

export const formColumnRoles: { value: FormColumnRole; label: string }[] = [
  { value: "k", label: "k component" },
  { value: "pathDistance", label: "Path distance" },
  { value: "band", label: "Band index" },
  { value: "energy", label: "Energy" },
  { value: "bandEnergy", label: "Energy of one band (wide)" },
  { value: "sigma", label: "σ (uncertainty)" },
  { value: "weight", label: "Weight" },
  { value: "label", label: "Branch / cut label" },
  { value: "ignore", label: "Ignore" },
];

/** Everything the form holds besides the file; text fields stay text until the mapping is built. */
export interface MappingDraft {
  name: string;
  description: string;
  source: "calculation" | "photoemission";
  energyReference: string;
  roles: FormColumnRole[];
  energyUnit: EnergyUnit;
  kKind: KKind;
  /** One lattice vector per line, three numbers in Å. */
  lattice: string;
  latticeConstant: string;
  /** One labelled point per line: `Γ 0 0 0`. */
  path: string;
  pathCoordinates: "reduced" | "cartesian";
}

const fromGuess = (role: ColumnRole): FormColumnRole => (role === "kReduced" || role === "kCartesian" ? "k" : role);

/** The form's starting state for a file: the header's guessed roles and the file name as the name. */
export function initialDraft(fileName: string, header: readonly string[], guessed: readonly ColumnRole[], suggestion: SuggestedMapping): MappingDraft {
  return {
    name: fileName.replace(/\.[^.]+$/, ""),
    description: "",
    source: "calculation",
    energyReference: "",
    roles: header.map((_, i) => fromGuess(guessed[i] ?? "ignore")),
    energyUnit: suggestion.energy?.unit ?? "eV",
    kKind: suggestion.k?.kind ?? "cartesian",
    lattice: "",
    latticeConstant: "",
    path: "",
    pathCoordinates: "reduced",
  };
}

const numbers = (line: string) => line.trim().split(/[\s,;]+/).filter(Boolean).map(Number);
const lines = (text: string) => text.split("\n").map((l) => l.trim()).filter(Boolean);

/**
 * The mapping JSON the draft describes (unvalidated: `datasetMappingSchema` judges it, on the client for
 * quick feedback and again on the server).
 */
export function draftToMapping(draft: MappingDraft, header: readonly string[]): DatasetMappingInput {
  const named = (role: FormColumnRole) => header.filter((_, i) => draft.roles[i] === role);
  const first = (role: FormColumnRole) => named(role)[0];
  const wide = named("bandEnergy").length > 0;
  const latticeLines = lines(draft.lattice);
  const pathLines = lines(draft.path);
  const k: DatasetMappingInput["k"] = { kind: draft.kKind };
  if (draft.kKind === "path") k.column = first("pathDistance");
  else k.columns = named("k");
  if (latticeLines.length > 0) k.lattice = latticeLines.map((l) => numbers(l) as [number, number, number]);
  if (draft.kKind === "twoPiOverA" && draft.latticeConstant.trim() !== "") k.latticeConstant = Number(draft.latticeConstant);
  if (pathLines.length > 0)
    k.path = pathLines.map((l) => {
      const [label, ...rest] = l.split(/\s+/);
      return { label, k: rest.map(Number), coordinates: draft.pathCoordinates };
    });
  const optional = (role: FormColumnRole) => (first(role) ? { column: first(role) as string } : undefined);
  return {
    name: draft.name,
    ...(draft.description.trim() ? { description: draft.description } : {}),
    source: draft.source,
    ...(draft.energyReference.trim() ? { energyReference: draft.energyReference } : {}),
    format: wide ? "wide" : "long",
    k,
    ...(wide ? {} : { band: optional("band") }),
    energy: wide ? { columns: named("bandEnergy"), unit: draft.energyUnit } : { column: first("energy"), unit: draft.energyUnit },
    sigma: optional("sigma"),
    weight: optional("weight"),
    label: optional("label"),
  };
}
