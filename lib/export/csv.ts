import { type EnergyAlignment, alignEnergy } from "@/lib/fit/bands/energy-alignment";
import { type ModelDocument, type Vec3, compileModel, computeBands, templateKPath } from "@/lib/tb";

/** One residual row as stored (energies eV, path distance 1/Å). */
export interface ResidualCsvRow {
  pointIndex: number;
  dataBand: number;
  modelBand: number;
  pathDistance: number;
  energy: number;
  modelEnergy: number;
  residual: number;
  weightedResidual: number;
}

// Full double precision: a CSV is a data export, not a display.
const number = (x: number) => String(x);

/** Per-point residuals as CSV (header line, then one line per point; energies eV, model − data). */
export function residualsCsv(rows: readonly ResidualCsvRow[]): string {
  const lines = ["point_index,data_band,model_band,path_distance_inv_angstrom,energy_ev,model_energy_ev,residual_ev,weighted_residual"];
  for (const r of rows)
    lines.push([r.pointIndex, r.dataBand, r.modelBand, r.pathDistance, r.energy, r.modelEnergy, r.residual, r.weightedResidual].map(number).join(","));
  return lines.join("\n") + "\n";
}

/** Points of the dense path per 1/Å of path length (common practice for smooth band plots). */
export const DENSE_PATH_POINTS_PER_INVERSE_ANGSTROM = 100;

/**
 * The fitted model's bands as CSV, in two sections: `data` at each distinct k of the dataset (its own path
 * distance), and `path` on a dense sampling of the model's k-path (when it has one). Every band of the model
 * at each k; `energy_ev` is the model's eigenvalue, `aligned_energy_ev` what the fit compared with the data.
 * @param dataK - distinct k-points of the dataset, Cartesian 1/Å, with their path distance (1/Å)
 */
export function bandsCsv(model: ModelDocument, dataK: readonly { k: Vec3; pathDistance: number }[], alignment: EnergyAlignment): string {
  const compiled = compileModel(model);
  const lines = ["section,k_index,path_distance_inv_angstrom,kx,ky,kz,band,energy_ev,aligned_energy_ev"];
  const emit = (section: string, points: readonly { k: Vec3; pathDistance: number }[]) => {
    const { energies } = computeBands(compiled, undefined, points.map((p) => p.k));
    const n = compiled.orbitalCount;
    points.forEach((p, i) => {
      for (let band = 0; band < n; band++) {
        const e = energies[i * n + band];
        lines.push([section, i, p.pathDistance, p.k[0], p.k[1], p.k[2], band + 1, e, alignEnergy(e, alignment)].map(String).join(","));
      }
    });
  };
  emit("data", dataK);
  if (model.kPath && model.kPath.length >= 2) {
    const path = templateKPath(model, { pointsPerInverseAngstrom: DENSE_PATH_POINTS_PER_INVERSE_ANGSTROM });
    emit("path", path.k.map((k, i) => ({ k, pathDistance: path.distance[i] })));
  }
  return lines.join("\n") + "\n";
}
