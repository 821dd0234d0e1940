import { type DatasetMapping, type DatasetMappingInput, datasetMappingSchema } from "@/lib/datasets";

/** A long-format mapping with Cartesian (kx, ky) columns, band and energy in eV; overrides merge on top. */
export function longMapping(overrides: Partial<DatasetMappingInput> = {}): DatasetMapping {
  return datasetMappingSchema.parse({
    name: "test file",
    source: "calculation",
    format: "long",
    k: { kind: "cartesian", columns: ["kx", "ky"] },
    band: { column: "band" },
    energy: { column: "E", unit: "eV" },
    ...overrides,
  });
}

/** Splits text into byte chunks of the given size, to exercise reads across chunk boundaries. */
export async function* chunked(bytes: Uint8Array, size: number): AsyncGenerator<Uint8Array> {
  for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
}
