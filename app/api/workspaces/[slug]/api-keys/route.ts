import { NextResponse } from "next/server";
import { createApiKeyInput } from "@/lib/schemas/api-keys";
import { createApiKey, listVisibleApiKeys } from "@/lib/server/api-keys";
import { workspaceRoute } from "@/lib/server/route";

/**
 * The keys the caller may manage (browser session only): an owner sees every key of the workspace, anyone
 * else their own → `{ apiKeys: [{ id, label, prefix, role, creatorName, createdByYou, createdAt, lastUsedAt }] }`.
 */
export const GET = workspaceRoute({ minimumRole: "viewer", sessionOnly: true }, async ({ access }) => ({
  apiKeys: await listVisibleApiKeys(access),
}));

/**
 * Creates a key for the caller (browser session only): `{ label, role }`, the role no higher than the
 * caller's own (else 403) → 201 `{ id, key, prefix, label, role, createdAt }`; `key` is shown this once.
 */
export const POST = workspaceRoute({ minimumRole: "viewer", sessionOnly: true, input: createApiKeyInput }, async ({ access, input }) => {
  const created = await createApiKey({ userId: access.user.id, workspaceId: access.workspace.id, label: input.label, role: input.role });
  return NextResponse.json(
    { id: created.id, key: created.key, prefix: created.keyPrefix, label: created.label, role: created.role, createdAt: created.createdAt },
    { status: 201, headers: { "cache-control": "no-store" } },
  );
});
