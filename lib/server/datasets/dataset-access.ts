import "server-only";
import { z } from "zod";
import { getDataset, type DatasetDetails } from "@/db/queries/datasets";
import { AppError } from "@/lib/server/errors";

const datasetIdSchema = z.uuid();

/**
 * The dataset `id` of the workspace, or AppError("not_found") — for a malformed id, an unknown one and
 * another workspace's alike, so ids of other workspaces are never confirmed.
 * @param workspaceId - the authorised workspace
 * @param id - the route's `id` segment, untrusted
 */
export async function requireDataset(workspaceId: string, id: string | undefined): Promise<DatasetDetails> {
  if (!datasetIdSchema.safeParse(id).success || id === undefined) throw new AppError("not_found", "No such dataset in this workspace.");
  const found = await getDataset({ workspaceId, id });
  if (!found) throw new AppError("not_found", "No such dataset in this workspace.");
  return found;
}

/** Whether a string is a dataset id at all (pages call notFound() otherwise). */
export const isDatasetId = (id: string): boolean => datasetIdSchema.safeParse(id).success;
