import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { apiKey, type NewApiKey } from "@/db/schema";

/** The key's owner and workspace, looked up by the SHA-256 hex of the presented key. */
export async function findApiKeyByHash(keyHash: string) {
  const rows = await db
    .select({ id: apiKey.id, userId: apiKey.userId, workspaceId: apiKey.workspaceId })
    .from(apiKey)
    .where(eq(apiKey.keyHash, keyHash))
    .limit(1);
  return rows[0] ?? null;
}

export async function insertApiKey(row: NewApiKey): Promise<void> {
  await db.insert(apiKey).values(row);
}

export async function markApiKeyUsed(id: string): Promise<void> {
  await db.update(apiKey).set({ lastUsedAt: new Date() }).where(eq(apiKey.id, id));
}
