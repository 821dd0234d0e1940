import { createHash, randomUUID } from "node:crypto";
import type { NewDataset } from "@/db/schema";
import type { DatasetMapping, DatasetSummary } from "@/lib/datasets";

// Shared by the upload route and the demo seed (a script, hence no "server-only" here). The points go to
// `insertDatasetWithPoints` as the parsed table's columns.

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
