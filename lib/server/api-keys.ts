import { createHash, randomBytes, randomUUID } from "node:crypto";
import { deleteWorkspaceApiKey, findApiKeyByHash, insertApiKey, listWorkspaceApiKeys, markApiKeyUsed } from "@/db/queries/api-keys";
import { getMembership } from "@/db/queries/workspaces";
import { type WorkspaceRole, hasRole } from "@/lib/auth/roles";
import { AppError } from "./errors";
import type { WorkspaceAccess } from "./workspace-access";

const keyMarker = "bw_";

/** SHA-256 hex of a key; the only form in which keys are stored. */
export function hashApiKey(key: string): string {
  return createHash("sha256").update(key, "utf8").digest("hex");
}

/** A new key as its creator sees it once: `key` in clear text is never stored or shown again. */
export interface CreatedApiKey {
  id: string;
  key: string;
  keyPrefix: string;
  label: string;
  role: WorkspaceRole;
  createdAt: Date;
}

/**
 * Creates a key for a member of one workspace. Its role may not be above the member's current role
 * (forbidden); without a role the key gets the member's current role. A non-member gets not_found.
 * 32 random bytes (256 bits) make guessing pointless, so a fast hash suffices (common practice).
 */
export async function createApiKey(params: { userId: string; workspaceId: string; label: string; role?: WorkspaceRole }): Promise<CreatedApiKey> {
  const membership = await getMembership({ workspaceId: params.workspaceId, userId: params.userId });
  if (!membership) throw new AppError("not_found");
  const role = params.role ?? membership.role;
  if (!hasRole(membership.role, role)) {
    throw new AppError("forbidden", `A key's role cannot be above your own: you are ${membership.role === "viewer" ? "a viewer" : `an ${membership.role}`} here.`);
  }
  const key = keyMarker + randomBytes(32).toString("base64url");
  const created = { id: randomUUID(), key, keyPrefix: key.slice(0, keyMarker.length + 6), label: params.label, role, createdAt: new Date() };
  await insertApiKey({
    id: created.id,
    label: created.label,
    keyHash: hashApiKey(key),
    keyPrefix: created.keyPrefix,
    role,
    userId: params.userId,
    workspaceId: params.workspaceId,
    createdAt: created.createdAt,
  });
  return created;
}

/** {@link createApiKey} for scripts and tests that need only the key's text. */
export async function issueApiKey(params: { userId: string; workspaceId: string; label: string; role?: WorkspaceRole }): Promise<string> {
  return (await createApiKey(params)).key;
}

/** The key's user, workspace and own role, or null for an unknown (or revoked) key. */
export async function verifyApiKey(key: string): Promise<{ userId: string; workspaceId: string; role: WorkspaceRole } | null> {
  if (!key.startsWith(keyMarker)) return null;
  const found = await findApiKeyByHash(hashApiKey(key));
  if (!found) return null;
  await markApiKeyUsed(found.id);
  return { userId: found.userId, workspaceId: found.workspaceId, role: found.role };
}

/**
 * The keys a member may see and revoke: an owner, every key of the workspace; anyone else, their own.
 * The hashes never leave the database.
 */
export async function listVisibleApiKeys(access: WorkspaceAccess) {
  const rows = await listWorkspaceApiKeys({ workspaceId: access.workspace.id, userId: access.role === "owner" ? undefined : access.user.id });
  return rows.map((row) => ({
    id: row.id,
    label: row.label,
    prefix: row.keyPrefix,
    role: row.role,
    creatorName: row.creatorName,
    createdByYou: row.userId === access.user.id,
    createdAt: row.createdAt,
    lastUsedAt: row.lastUsedAt,
  }));
}

/**
 * Revokes a key at once (its next request gets 401): the key's creator may, and an owner may revoke any
 * key of the workspace. A key the member may not revoke is not_found, the same as an unknown one.
 */
export async function revokeApiKey(access: WorkspaceAccess, keyId: string): Promise<void> {
  const deleted = await deleteWorkspaceApiKey({ workspaceId: access.workspace.id, keyId, userId: access.role === "owner" ? undefined : access.user.id });
  if (!deleted) throw new AppError("not_found", "There is no such key in this workspace, or it is not yours to revoke.");
}
