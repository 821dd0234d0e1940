import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { inject } from "vitest";
import { countWorkspaceDatasetRows } from "@/db/queries/datasets";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import type { DatasetMappingInput } from "@/lib/datasets";
import { issueApiKey } from "@/lib/server/api-keys";
import type { TestResponse } from "@/tests/support/client";
import { createTeam, type Team } from "@/tests/support/workspace";

const fixturesFolder = fileURLToPath(new URL("../../../fixtures/", import.meta.url));

export const fixtureBytes = (name: string) => new Uint8Array(readFileSync(`${fixturesFolder}${name}`));
export const fixtureMappings = JSON.parse(readFileSync(`${fixturesFolder}mappings.json`, "utf8")) as Record<string, DatasetMappingInput>;

/** A team plus an API key of its editor, for multipart uploads (TestClient speaks JSON only). */
export type UploadTeam = Team & { workspaceId: string; editorKey: string };

export async function createUploadTeam(name: string): Promise<UploadTeam> {
  const team = await createTeam(name);
  const workspace = await getWorkspaceBySlug(team.slug);
  if (!workspace) throw new Error("workspace missing");
  const members = await team.owner.get(`/api/workspaces/${team.slug}/members`);
  const editor = (members.body as { members: { userId: string; role: string }[] }).members.find((m) => m.role === "editor");
  if (!editor) throw new Error("editor missing");
  const editorKey = await issueApiKey({ userId: editor.userId, workspaceId: workspace.id, label: "dataset tests" });
  return { ...team, workspaceId: workspace.id, editorKey };
}

/** POSTs `file` and `mapping` as multipart/form-data with a bearer key. */
export async function upload(
  team: UploadTeam,
  file: { name: string; bytes: Uint8Array | string; type?: string },
  mapping: unknown,
): Promise<TestResponse> {
  const form = new FormData();
  form.append("file", new Blob([file.bytes as BlobPart], { type: file.type ?? "text/csv" }), file.name);
  form.append("mapping", typeof mapping === "string" ? mapping : JSON.stringify(mapping));
  const response = await fetch(new URL(`/api/workspaces/${team.slug}/datasets`, inject("baseUrl")), {
    method: "POST",
    headers: { authorization: `Bearer ${team.editorKey}` },
    body: form,
  });
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null, headers: response.headers };
}

/** Datasets and points stored for the workspace (a refused upload must leave both unchanged). */
export const storedRows = (team: UploadTeam) => countWorkspaceDatasetRows(team.workspaceId);

/** The 422 body's issues. */
export type Refusal = {
  error: { code: string; message: string; issues: { row: number | null; column: number | null; columnName: string | null; message: string }[]; issueCount: number; fieldErrors?: Record<string, string[]> };
};
