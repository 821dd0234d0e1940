// The shared real Si band file, read through the product's own parser. Source: all-electron PBE band
// structure of Si computed with Elk 8.4.30 (tests/data/dft, see its README).
import { readFile } from "node:fs/promises";
import { datasetMappingSchema, parseDispersionFile } from "@/lib/datasets";
import type { DataPoint } from "@/lib/datasets";
import { dftDataPath } from "@/tests/support/dft-data";

const FILE = dftDataPath("silicon-pbe-bands.csv");

/** The 240 k × 12 bands of the file as data points (Cartesian k, 1/Å; energies in eV from the VBM). */
export async function siliconDftPoints(): Promise<DataPoint[]> {
  const mapping = datasetMappingSchema.parse({
    name: "Si PBE",
    source: "calculation",
    format: "long",
    k: { kind: "cartesian", columns: ["k_cart_x", "k_cart_y", "k_cart_z"] },
    band: { column: "band" },
    energy: { column: "energy_eV", unit: "eV" },
  });
  const parsed = await parseDispersionFile(await readFile(FILE), mapping);
  if (!parsed.ok) throw new Error(`the shared Si file did not parse: ${parsed.issues.map((i) => i.message).join("; ")}`);
  return parsed.points;
}
