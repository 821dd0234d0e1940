import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { apiKey, type NewApiKey, user } from "@/db/schema";
import { type WorkspaceRole, isWorkspaceRole } from "@/lib/auth/roles";

// A check constraint allows only our three roles; anything else is corruption.
function storedKeyRole(value: string): WorkspaceRole {
  if (isWorkspaceRole(value)) return value;
  throw new Error(`Unknown API key role in the database: ${value}`);
}

/** The key's owner, workspace and role, looked up by the SHA-256 hex of the presented key. */
export async function findApiKeyByHash(keyHash: string) {
  const rows = await db
    .select({ id: apiKey.id, userId: apiKey.userId, workspaceId: apiKey.workspaceId, role: apiKey.role })
    .from(apiKey)
    .where(eq(apiKey.keyHash, keyHash))
    .limit(1);
  return rows[0] ? { ...rows[0], role: storedKeyRole(rows[0].role) } : null;
}

export async function insertApiKey(row: NewApiKey): Promise<void> {
  await db.insert(apiKey).values(row);
}

export async function markApiKeyUsed(id: string): Promise<void> {
  await db.update(apiKey).set({ lastUsedAt: new Date() }).where(eq(apiKey.id, id));
}

/**
 * A workspace's keys, newest first, without their hashes: all of them, or only `userId`'s.
 * @param params.userId - set to list one member's keys only
 */
export async function listWorkspaceApiKeys(params: { workspaceId: string; userId?: string }) {
  const rows = await db
    .select({
      id: apiKey.id,
      label: apiKey.label,
      keyPrefix: apiKey.keyPrefix,
      role: apiKey.role,
      userId: apiKey.userId,
      creatorName: user.name,
      creatorEmail: user.email,
      createdAt: apiKey.createdAt,
      lastUsedAt: apiKey.lastUsedAt,
    })
    .from(apiKey)
    .innerJoin(user, eq(user.id, apiKey.userId))
    .where(and(eq(apiKey.workspaceId, params.workspaceId), params.userId === undefined ? undefined : eq(apiKey.userId, params.userId)))
    .orderBy(desc(apiKey.createdAt), desc(apiKey.id));
  return rows.map((row) => ({ ...row, role: storedKeyRole(row.role) }));
}
export type ApiKeyListRow = Awaited<ReturnType<typeof listWorkspaceApiKeys>>[number];

/**
 * Deletes one key of a workspace, only if it belongs to `userId` when that is given (non-owners revoke
 * their own keys only). True when a key was deleted.
 */
export async function deleteWorkspaceApiKey(params: { workspaceId: string; keyId: string; userId?: string }): Promise<boolean> {
  const deleted = await db
    .delete(apiKey)
    .where(
      and(
        eq(apiKey.id, params.keyId),
        eq(apiKey.workspaceId, params.workspaceId),
        params.userId === undefined ? undefined : eq(apiKey.userId, params.userId),
      ),
    )
    .returning({ id: apiKey.id });
  return deleted.length > 0;
}
