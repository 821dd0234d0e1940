import "server-only";
import { NextResponse } from "next/server";
import { findDatasetBySha256, insertDatasetWithPoints } from "@/db/queries/datasets";
import { describeByteLimit, parseDatasetMapping, parseDispersionTable, type FileIssue } from "@/lib/datasets";
import { env } from "@/lib/env";
import type { WorkspaceAccess } from "@/lib/server/workspace-access";
import { yieldToEventLoop } from "@/lib/server/yield-to-event-loop";
import { readUploadParts } from "./read-upload";
import { datasetRecord, sha256Hex } from "./stored-dataset";

/** An issue as the 422 body lists it: row and column 1-based (null when not tied to one), with the header name. */
export type UploadIssue = FileIssue;

/** Body of a refused upload (422). `fieldErrors` names mapping fields; `issues` rows and columns of the file. */
export type UploadRefusal = {
  error: {
    code: "validation_failed";
    message: string;
    issues: UploadIssue[];
    issueCount: number;
    fieldErrors?: Record<string, string[]>;
  };
};

/** Body of a duplicate upload (409): the dataset that already holds these bytes. */
export type UploadConflict = { error: { code: "conflict"; message: string; datasetId: string; href: string } };

/** Body of an accepted upload (201). */
export type UploadAccepted = { id: string; pointCount: number; bandCount: number; warnings: string[] };

const refuse = (message: string, issues: UploadIssue[], extra: { issueCount?: number; fieldErrors?: Record<string, string[]> } = {}) =>
  NextResponse.json<UploadRefusal>(
    {
      error: {
        code: "validation_failed",
        message,
        issues,
        issueCount: extra.issueCount ?? issues.length,
        ...(extra.fieldErrors ? { fieldErrors: extra.fieldErrors } : {}),
      },
    },
    { status: 422 },
  );

const conflict = (slug: string, existing: { id: string; name: string }) =>
  NextResponse.json<UploadConflict>(
    {
      error: {
        code: "conflict",
        message: `This file is already in the workspace as “${existing.name}”.`,
        datasetId: existing.id,
        href: `/w/${slug}/datasets/${existing.id}`,
      },
    },
    { status: 409 },
  );

function parseMappingJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

const isUniqueViolation = (error: unknown): boolean =>
  typeof error === "object" && error !== null && "cause" in error
    ? isUniqueViolation((error as { cause: unknown }).cause)
    : typeof error === "object" && error !== null && (error as { code?: unknown }).code === "23505";

/**
 * The whole upload: reads the multipart body within the size limit, validates the mapping, hashes the
 * bytes, refuses a file already in the workspace, re-parses the stored bytes with the mapping (streaming)
 * and stores dataset and points in one transaction. Nothing is stored unless every row is good.
 * Limits: `DATASET_MAX_BYTES` and `DATASET_MAX_POINTS` (lib/env.ts).
 * @returns 201 {@link UploadAccepted}, 409 {@link UploadConflict} or 422 {@link UploadRefusal}
 */
export async function uploadDataset(request: Request, access: WorkspaceAccess): Promise<Response> {
  const maxBytes = env.DATASET_MAX_BYTES;
  const parts = await readUploadParts(request, maxBytes);
  const sizeIssue = (): UploadIssue => ({
    row: null,
    column: null,
    columnName: null,
    message: `the file is larger than the limit of ${describeByteLimit(maxBytes)}`,
  });
  if ("tooLarge" in parts) return refuse("The file is too large.", [sizeIssue()]);

  const mappingJson = parseMappingJson(parts.mappingText);
  if (mappingJson === undefined)
    return refuse("The mapping is not valid JSON.", [], { fieldErrors: { mapping: ["the mapping is not valid JSON"] } });
  const mapping = parseDatasetMapping(mappingJson);
  if (!mapping.ok) {
    const first = Object.entries(mapping.fieldErrors)[0];
    return refuse(first ? `${first[0]}: ${first[1][0]}` : "The mapping is invalid.", [], { fieldErrors: mapping.fieldErrors });
  }
  if (parts.file.size > maxBytes) return refuse("The file is too large.", [sizeIssue()]);

  const bytes = new Uint8Array(await parts.file.arrayBuffer());
  const sha256 = sha256Hex(bytes);
  const existing = await findDatasetBySha256({ workspaceId: access.workspace.id, sha256 });
  if (existing) return conflict(access.workspace.slug, existing);

  // The stored bytes, not anything the browser parsed, decide: re-read them as a stream, letting other
  // requests run between chunks (a 500 000-point parse would otherwise hold the server for a second).
  const parsed = await parseDispersionTable(new Blob([bytes]).stream(), mapping.mapping, {
    maxBytes,
    maxPoints: env.DATASET_MAX_POINTS,
    pause: yieldToEventLoop,
  });
  if (!parsed.ok) {
    const shown = parsed.issues.length < parsed.issueCount ? ` (the first ${parsed.issues.length} are listed)` : "";
    return refuse(`The file has ${parsed.issueCount} problem${parsed.issueCount === 1 ? "" : "s"}${shown}; nothing was stored.`, parsed.issues, {
      issueCount: parsed.issueCount,
    });
  }

  const record = datasetRecord({
    workspaceId: access.workspace.id,
    uploadedBy: access.user.id,
    mapping: mapping.mapping,
    summary: parsed.summary,
    file: { name: parts.file.name || "upload.csv", type: parts.file.type || "text/csv", bytes, sha256 },
  });
  try {
    await insertDatasetWithPoints(record, parsed.table);
  } catch (error) {
    // Two uploads of the same file at once: the unique index lets one through.
    if (!isUniqueViolation(error)) throw error;
    const winner = await findDatasetBySha256({ workspaceId: access.workspace.id, sha256 });
    if (winner) return conflict(access.workspace.slug, winner);
    throw error;
  }
  return NextResponse.json<UploadAccepted>(
    { id: record.id, pointCount: parsed.summary.pointCount, bandCount: parsed.summary.bandCount, warnings: parsed.warnings },
    { status: 201 },
  );
}
