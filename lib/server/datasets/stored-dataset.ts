import { createHash, randomUUID } from "node:crypto";
import type { NewDataset, NewDatasetPoint } from "@/db/schema";
import type { DataPoint, DatasetMapping, DatasetSummary } from "@/lib/datasets";

// Shared by the upload route and the demo seed (a script, hence no "server-only" here).

/** SHA-256 of a file's bytes, lower-case hex: the duplicate check and the provenance of every fit. */
export const sha256Hex = (bytes: Uint8Array): string => createHash("sha256").update(bytes).digest("hex");

/** The dataset row for a parsed file (a fresh id; the caller stores it with its points). */
export function datasetRecord(input: {
  workspaceId: string;
  uploadedBy: string | null;
  mapping: DatasetMapping;
  summary: DatasetSummary;
  file: { name: string; type: string; bytes: Uint8Array; sha256: string };
}): NewDataset {
  const { mapping, summary, file } = input;
  return {
    id: randomUUID(),
    workspaceId: input.workspaceId,
    name: mapping.name,
    description: mapping.description ?? "",
    source: mapping.source,
    energyReference: mapping.energyReference ?? null,
    mapping,
    summary,
    fileName: file.name,
    fileType: file.type,
    fileSize: file.bytes.byteLength,
    fileSha256: file.sha256,
    fileBytes: Buffer.from(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength),
    pointCount: summary.pointCount,
    bandCount: summary.bandCount,
    uploadedBy: input.uploadedBy,
  };
}

/** Parsed points as rows, numbered in file order (the index fits' residuals refer to). */
export function pointRecords(points: readonly DataPoint[]): Omit<NewDatasetPoint, "datasetId">[] {
  return points.map((p, index) => ({
    index,
    row: p.row,
    kIndex: p.kIndex,
    kx: p.k[0],
    ky: p.k[1],
    kz: p.k[2],
    pathDistance: p.pathDistance,
    band: p.band,
    energy: p.energy,
    sigma: p.sigma ?? null,
    weight: p.weight ?? null,
    label: p.label ?? null,
  }));
}
