import { NextResponse } from "next/server";
import { listFits } from "@/db/queries/fits";
import { launchFitSchema } from "@/lib/server/fits/inputs";
import { launchFit } from "@/lib/server/fits/launch";
import { workspaceRoute } from "@/lib/server/route";

/** The workspace's fits, newest first: `{ fits: [{ id, name, notes, datasetId, createdAt, latestRevision, latestStatus }] }`. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access }) => ({ fits: await listFits(access.workspace.id) }));

/**
 * Launches a fit (editor or owner): `{ datasetId, name, notes?, model, mapping?, window?, options? }` →
 * 201 `{ fitId, revision: 1, warnings }`. Every check runs before anything is stored.
 */
export const POST = workspaceRoute({ minimumRole: "editor", input: launchFitSchema }, async ({ access, input }) => {
  const launched = await launchFit({ workspaceId: access.workspace.id, userId: access.user.id, input });
  return NextResponse.json(launched, { status: 201 });
});
