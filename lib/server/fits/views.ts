import "server-only";
import { type RevisionDetails, getFit, getRevision } from "@/db/queries/fits";
import { type StoredResult, readStoredResult } from "@/lib/fit/bands";
import { positiveIntFromUrl } from "@/lib/schemas/url-integer";
import { AppError } from "../errors";
import { type RevisionSnapshot, revisionSnapshotSchema } from "./snapshot";

const revisionNumberSchema = positiveIntFromUrl("revision");

/**
 * A revision number as written in a URL (digits, no leading zero, 1 … 2³¹ − 1: `positiveIntFromUrl`), or
 * null. A larger one cannot exist, and passing it to the database would fail the query (a 500) instead of
 * finding nothing.
 */
export function parseRevisionNumber(raw: unknown): number | null {
  if (typeof raw !== "string") return null;
  const parsed = revisionNumberSchema.safeParse(raw);
  return parsed.success && String(parsed.data) === raw ? parsed.data : null;
}

/** Parses a revision number from the URL; anything else (also a number no revision can have) is a 404. */
export function revisionNumber(raw: string | undefined): number {
  const n = parseRevisionNumber(raw);
  if (n === null) throw new AppError("not_found", "No such revision of this fit.");
  return n;
}

/** The fit of the workspace or 404. */
export async function requireFit(workspaceId: string, fitId: string | undefined) {
  const found = fitId ? await getFit({ workspaceId, fitId }) : null;
  if (!found) throw new AppError("not_found", "No such fit in this workspace.");
  return found;
}

/** The revision of the workspace's fit or 404. */
export async function requireRevision(workspaceId: string, params: Record<string, string>): Promise<RevisionDetails> {
  const found = params.fitId ? await getRevision({ workspaceId, fitId: params.fitId, number: revisionNumber(params.n) }) : null;
  if (!found) throw new AppError("not_found", "No such revision of this fit.");
  return found;
}

/** The revision's snapshot (its stored inputs). */
export function snapshotOf(details: RevisionDetails): RevisionSnapshot {
  return revisionSnapshotSchema.parse(details.revision.inputs);
}

/** The revision's stored result in today's parameter names, or null while it has none. */
export function resultOf(details: Pick<RevisionDetails, "revision">): StoredResult | null {
  const result = details.revision.result as StoredResult | null;
  return result ? readStoredResult(result) : null;
}

/** The revision's stored result or 409 when it has none (still queued or running, or failed). */
export function requireResult(details: RevisionDetails): StoredResult {
  const result = resultOf(details);
  if (!result) throw new AppError("conflict", `Revision ${details.revision.number} has no result yet (status: ${details.revision.status}).`);
  return result;
}

/** The JSON view of a revision served by `GET …/revisions/{n}`. */
export function revisionView(details: RevisionDetails) {
  const { revision, fit } = details;
  return {
    fitId: fit.id,
    fitName: fit.name,
    number: revision.number,
    parentNumber: revision.parentNumber,
    status: revision.status,
    progress: revision.progress,
    attempts: revision.attempts,
    runner: revision.runner,
    heartbeatAt: revision.heartbeatAt,
    failureReason: revision.failureReason,
    cancelRequested: revision.cancelRequested,
    launchedBy: details.launcherName,
    createdAt: revision.createdAt,
    startedAt: revision.startedAt,
    finishedAt: revision.finishedAt,
    launchWarnings: revision.launchWarnings,
    inputs: snapshotOf(details),
    result: resultOf(details),
  };
}
