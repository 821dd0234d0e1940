import "server-only";
import type { RevisionDetails } from "@/db/queries/fits";
import { ENERGY_OFFSET, RENORMALISATION, type StoredResult } from "@/lib/fit/bands";
import { type EnergyAlignment, type ParameterSet, buildParameterSet } from "@/lib/export";
import packageJson from "@/package.json";
import type { RevisionSnapshot } from "./snapshot";
import { requireResult, snapshotOf } from "./views";

/** The energy alignment a fit used: its fitted (or fixed) δ and Z and the reference E_ref, eV. */
export function alignmentOf(result: StoredResult, snapshot: RevisionSnapshot): EnergyAlignment {
  const value = (name: string) => result.parameters.find((p) => p.name === name)?.value;
  return {
    offset: value(ENERGY_OFFSET) ?? snapshot.options.energyOffset.value,
    renormalisation: value(RENORMALISATION) ?? snapshot.options.renormalisation.value,
    reference: snapshot.options.renormalisation.reference,
  };
}

/** The parameter set of a finished revision (409 when it has no result). */
export function exportRevision(details: RevisionDetails): ParameterSet {
  const result = requireResult(details);
  const snapshot = snapshotOf(details);
  return buildParameterSet(result, alignmentOf(result, snapshot), {
    dataset: snapshot.dataset,
    fit: { id: details.fit.id, name: details.fit.name },
    revision: details.revision.number,
    launchedBy: details.launcherName,
    launchedAt: details.revision.createdAt,
    finishedAt: details.revision.finishedAt,
    exportedAt: new Date(),
    softwareVersion: packageJson.version,
  });
}
