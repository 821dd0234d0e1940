import { requireRevision, revisionView } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/** One revision: `{ status, progress, attempts, failureReason, inputs, launchWarnings, result: { rms, reducedChiSquared, parameters, bands, warnings, … } }`. */
export const GET = workspaceRoute({ minimumRole: "viewer" }, async ({ access, params }) =>
  revisionView(await requireRevision(access.workspace.id, params)),
);
