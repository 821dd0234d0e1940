import { NextResponse } from "next/server";
import { getRevision } from "@/db/queries/fits";
import { AppError } from "@/lib/server/errors";
import { newRevisionSchema } from "@/lib/server/fits/inputs";
import { launchRevision } from "@/lib/server/fits/launch";
import { requireFit, resultOf } from "@/lib/server/fits/views";
import { workspaceRoute } from "@/lib/server/route";

/**
 * A new revision (editor or owner): `{ from: n, model?, parameters?, mapping?, window?, options? }` copies
 * revision n's inputs with its fitted values as start values, applies the changes → 201 `{ fitId, revision }`.
 */
export const POST = workspaceRoute({ minimumRole: "editor", input: newRevisionSchema }, async ({ access, params, input }) => {
  const fit = await requireFit(access.workspace.id, params.fitId);
  const parent = await getRevision({ workspaceId: access.workspace.id, fitId: fit.id, number: input.from });
  if (!parent) throw new AppError("validation_failed", `from: this fit has no revision ${input.from}`, { issues: { from: [`this fit has no revision ${input.from}`] } });
  const launched = await launchRevision({
    workspaceId: access.workspace.id,
    userId: access.user.id,
    fitId: fit.id,
    datasetId: fit.datasetId,
    parent: { inputs: parent.revision.inputs, result: resultOf(parent) },
    input,
  });
  return NextResponse.json(launched, { status: 201 });
});
