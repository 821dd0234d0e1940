import { NextResponse } from "next/server";
import { listFits } from "@/db/queries/fits";
import { fitListQuerySchema, launchFitSchema } from "@/lib/server/fits/inputs";
import { launchFit } from "@/lib/server/fits/launch";
import { parseInput } from "@/lib/server/parse-input";
import { workspaceRoute } from "@/lib/server/route";

/**
 * The workspace's fits, newest first; `?dataset=<id>` keeps one dataset's fits →
 * `{ fits: [{ id, name, notes, datasetId, datasetName, createdByName, createdAt, latestRevision,
 * latestStatus, latestRms, latestFinishedAt }] }` (RMS in eV; null fields while no revision has them).
 */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, request }) => {
  const query = parseInput(fitListQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  return { fits: await listFits({ workspaceId: access.workspace.id, datasetId: query.dataset }) };
});

/**
 * Launches a fit (editor or owner): `{ datasetId, name, notes?, model, mapping?, window?, options? }` →
 * 201 `{ fitId, revision: 1, warnings }`. Every check runs before anything is stored.
 */
export const POST = workspaceRoute({ minimumRole: "editor", input: launchFitSchema }, async ({ access, input }) => {
  const launched = await launchFit({ workspaceId: access.workspace.id, userId: access.user.id, input });
  return NextResponse.json(launched, { status: 201 });
});
