import type { EnergyUnit } from "@/lib/units";
import type { DatasetMappingInput, KKind } from "./mapping";

/** What a column holds, as the upload form offers it. */
export type ColumnRole =
  | "kReduced"
  | "kCartesian"
  | "pathDistance"
  | "band"
  | "energy"
  | "bandEnergy"
  | "sigma"
  | "weight"
  | "label"
  | "ignore";

export interface ColumnGuess {
  column: string;
  role: ColumnRole;
  /** Energy unit read from a suffix such as `_meV` or `(eV)`, for energy and σ columns. */
  unit?: EnergyUnit;
}

/** The parts of a mapping that a header alone suggests; name and source are left to the user. */
export type SuggestedMapping = Partial<
  Pick<DatasetMappingInput, "format" | "band" | "sigma" | "weight" | "label">
> & {
  k?: { kind: KKind; columns?: string[]; column?: string };
  energy?: { column?: string; columns?: string[]; unit: EnergyUnit };
};

export interface ColumnRoleGuess {
  columns: ColumnGuess[];
  suggestion: SuggestedMapping;
}

const UNIT_SUFFIX = /(?:^|[\s_(\[/-])(mev|ev|ry|ryd|rydberg|ha|hartree)[)\]]?$/i;
const UNIT_NAMES: Record<string, EnergyUnit> = {
  mev: "meV",
  ev: "eV",
  ry: "Ry",
  ryd: "Ry",
  rydberg: "Ry",
  ha: "Ha",
  hartree: "Ha",
};

/**
 * The energy unit a header name states in a suffix: `energy_eV`, `E (meV)`, `dE[meV]`, `e_Ry`, `E/Ha`.
 * @param name - a header cell
 */
export function guessEnergyUnit(name: string): EnergyUnit | undefined {
  const match = UNIT_SUFFIX.exec(name.trim());
  return match ? UNIT_NAMES[match[1].toLowerCase()] : undefined;
}

/** Lower case, unit suffix and bracketed units removed, separators folded to "_". */
const baseName = (name: string): string =>
  name
    .trim()
    .replace(UNIT_SUFFIX, "")
    .replace(/\s*[(\[][^)\]]*[)\]]$/, "")
    .toLowerCase()
    .replace(/[\s.\-/]+/g, "_")
    .replace(/_+$/, "");

const ROLE_PATTERNS: [ColumnRole, RegExp][] = [
  ["kReduced", /^(?:k_?(?:frac|red|reduced|rel|f)_?[123xyz]|k_?[123])$/],
  ["kCartesian", /^(?:k_?(?:cart|c)_?[xyz]|k_?[xyz]|k_?(?:par|parallel|∥))$/],
  ["pathDistance", /^(?:path_?(?:distance|dist|length)?|k_?(?:dist|distance|path)|distance|dist)$/],
  ["band", /^(?:band|band_?(?:index|no|number|n)|i_?band|ib|bnd)$/],
  ["bandEnergy", /^(?:band|b|e|en|energy)_?\d+$/],
  ["energy", /^(?:energy|e|en|eng|eig|eigenvalue|e_?-?_?e_?f|e_?minus_?ef)$/],
  ["sigma", /^(?:sigma|σ|d_?e|de|err|error|e_?err|energy_?err(?:or)?|unc|uncertainty|std|stderr)$/],
  ["weight", /^(?:weight|w|wt)$/],
  ["label", /^(?:label|branch|cut|segment|line)$/],
];

/**
 * Suggests a role per column from header names alone (`k_frac_1`, `kx`, `k_cart_y`, `path_distance`, `band`,
 * `energy_eV`, `E (meV)`, `dE`, `weight`, `cut`…), and the mapping pieces they imply: long format with a
 * band column, or wide format when several numbered energy columns (`band1`, `E_2`…) stand without one.
 * A `branch` column is the band index when no band column exists (photoemission branches are the data's
 * bands), otherwise a label; `cut` and `label` are always the label.
 * @param header - the header cells
 */
export function guessColumnRoles(header: readonly string[]): ColumnRoleGuess {
  const bases = header.map(baseName);
  const roles = bases.map((base) => ROLE_PATTERNS.find(([, pattern]) => pattern.test(base))?.[0] ?? "ignore");
  // Photoemission branches are the data's bands: without a band column, the first `branch` numbers them.
  const branch = bases.findIndex((base, i) => base === "branch" && roles[i] === "label");
  if (!roles.includes("band") && branch !== -1) roles[branch] = "band";
  const columns: ColumnGuess[] = header.map((column, i) => {
    const role = roles[i];
    const unit = role === "energy" || role === "bandEnergy" || role === "sigma" ? guessEnergyUnit(column) : undefined;
    return unit ? { column, role, unit } : { column, role };
  });
  const named = (role: ColumnRole) => columns.filter((c) => c.role === role);
  const first = (role: ColumnRole) => named(role)[0];

  const suggestion: SuggestedMapping = {};
  const reduced = named("kReduced").slice(0, 3);
  const cartesian = named("kCartesian").slice(0, 3);
  const distance = first("pathDistance");
  // Coordinates win over a distance column: they carry more information.
  if (cartesian.length > 0) suggestion.k = { kind: "cartesian", columns: cartesian.map((c) => c.column) };
  else if (reduced.length > 0) suggestion.k = { kind: "reduced", columns: reduced.map((c) => c.column) };
  else if (distance) suggestion.k = { kind: "path", column: distance.column };

  const band = first("band");
  const energy = first("energy");
  const numbered = named("bandEnergy").sort((a, b) => trailingNumber(a.column) - trailingNumber(b.column));
  if (!band && numbered.length >= 2) {
    suggestion.format = "wide";
    suggestion.energy = { columns: numbered.map((c) => c.column), unit: numbered[0].unit ?? "eV" };
  } else {
    suggestion.format = "long";
    if (band) suggestion.band = { column: band.column };
    if (energy) suggestion.energy = { column: energy.column, unit: energy.unit ?? "eV" };
  }
  const sigma = first("sigma");
  if (sigma) suggestion.sigma = sigma.unit ? { column: sigma.column, unit: sigma.unit } : { column: sigma.column };
  const weight = first("weight");
  if (weight) suggestion.weight = { column: weight.column };
  const label = first("label");
  if (label) suggestion.label = { column: label.column };
  return { columns, suggestion };
}

const trailingNumber = (name: string): number => Number(/(\d+)\D*$/.exec(name)?.[1] ?? 0);
