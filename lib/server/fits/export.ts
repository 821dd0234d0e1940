import "server-only";
import type { RevisionDetails } from "@/db/queries/fits";
import { type ParameterSet, buildParameterSet } from "@/lib/export";
import packageJson from "@/package.json";
import { requireResult, snapshotOf } from "./views";

/** The parameter set of a finished revision (409 when it has no result). */
export function exportRevision(details: RevisionDetails): ParameterSet {
  const result = requireResult(details);
  const snapshot = snapshotOf(details);
  return buildParameterSet(result, snapshot, {
    dataset: { ...snapshot.dataset, source: details.datasetSource, energyReference: details.datasetEnergyReference },
    fit: { id: details.fit.id, name: details.fit.name },
    revision: details.revision.number,
    launchedBy: details.launcherName,
    launchedAt: details.revision.createdAt,
    finishedAt: details.revision.finishedAt,
    exportedAt: new Date(),
    softwareVersion: packageJson.version,
  });
}
