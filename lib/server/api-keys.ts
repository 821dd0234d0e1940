import { createHash, randomBytes, randomUUID } from "node:crypto";
import { findApiKeyByHash, insertApiKey, markApiKeyUsed } from "@/db/queries/api-keys";

const keyMarker = "bw_";

/** SHA-256 hex of a key; the only form in which keys are stored. */
export function hashApiKey(key: string): string {
  return createHash("sha256").update(key, "utf8").digest("hex");
}

/**
 * Creates a key for `userId` within one workspace and returns it in clear text, once.
 * 32 random bytes (256 bits) make guessing pointless, so a fast hash suffices (common practice).
 */
export async function issueApiKey(params: { userId: string; workspaceId: string; label: string }): Promise<string> {
  const key = keyMarker + randomBytes(32).toString("base64url");
  await insertApiKey({
    id: randomUUID(),
    label: params.label,
    keyHash: hashApiKey(key),
    keyPrefix: key.slice(0, keyMarker.length + 6),
    userId: params.userId,
    workspaceId: params.workspaceId,
  });
  return key;
}

/** The key's user and workspace, or null for an unknown key. */
export async function verifyApiKey(key: string): Promise<{ userId: string; workspaceId: string } | null> {
  if (!key.startsWith(keyMarker)) return null;
  const found = await findApiKeyByHash(hashApiKey(key));
  if (!found) return null;
  await markApiKeyUsed(found.id);
  return { userId: found.userId, workspaceId: found.workspaceId };
}
