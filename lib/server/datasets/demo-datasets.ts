import { readFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { z } from "zod";
import { findDatasetBySha256, insertDatasetWithPoints } from "@/db/queries/datasets";
import { datasetMappingSchema, describeFileIssue, parseDispersionTable } from "@/lib/datasets";
import { datasetRecord, sha256Hex } from "./stored-dataset";

// The demo workspace's datasets: the files of fixtures/ with the mappings in fixtures/mappings.json.
// Called by scripts/seed.ts (a script: no "server-only" imports here).

const fixturesFolder = fileURLToPath(new URL("../../../fixtures/", import.meta.url));
const mappingsSchema = z.record(z.string(), datasetMappingSchema);

const fileType = (name: string) => (name.endsWith(".tsv") ? "text/tab-separated-values" : "text/csv");

/**
 * Stores every fixture file in the workspace unless a dataset with the same bytes is already there, so
 * running the seed again changes nothing.
 * @returns the names of the datasets added now
 * @throws when a fixture no longer parses (the fixtures and their mappings are out of step)
 */
export async function seedDemoDatasets(params: { workspaceId: string; uploadedBy: string }): Promise<string[]> {
  const mappings = mappingsSchema.parse(JSON.parse(await readFile(`${fixturesFolder}mappings.json`, "utf8")));
  const added: string[] = [];
  for (const [fileName, mapping] of Object.entries(mappings)) {
    const bytes = new Uint8Array(await readFile(`${fixturesFolder}${fileName}`));
    const sha256 = sha256Hex(bytes);
    if (await findDatasetBySha256({ workspaceId: params.workspaceId, sha256 })) continue;
    const parsed = await parseDispersionTable(bytes, mapping);
    if (!parsed.ok) throw new Error(`fixture ${fileName} does not parse: ${parsed.issues.map(describeFileIssue).join("; ")}`);
    const record = datasetRecord({
      workspaceId: params.workspaceId,
      uploadedBy: params.uploadedBy,
      mapping,
      summary: parsed.summary,
      file: { name: fileName, type: fileType(fileName), bytes, sha256 },
    });
    await insertDatasetWithPoints(record, parsed.table);
    added.push(mapping.name);
  }
  return added;
}
