import "server-only";
import { notFound } from "next/navigation";
import { listRevisionNumbers } from "@/db/queries/fits";
import { parseRevisionNumber } from "./views";

/**
 * For the fit pages, after the membership check: the revision numbers written in the URL (`rawNumbers`,
 * path segments or query values), parsed — or notFound() unless the workspace has the fit and each of
 * those revisions. So an unknown, foreign or malformed fit id, or a revision number that does not exist
 * (out of range included), answers 404 from the server instead of a 200 shell whose requests then fail.
 */
export async function requireFitRevisions(workspaceId: string, fitId: string, rawNumbers: unknown[] = []): Promise<number[]> {
  const numbers = rawNumbers.map(parseRevisionNumber);
  if (numbers.includes(null)) notFound();
  const existing = await listRevisionNumbers({ workspaceId, fitId });
  if (!existing) notFound();
  return numbers.map((n) => (n !== null && existing.includes(n) ? n : notFound()));
}
