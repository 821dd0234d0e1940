import { revokeApiKey } from "@/lib/server/api-keys";
import { workspaceRoute } from "@/lib/server/route";

/**
 * Revokes a key (browser session only) → 204: its creator may, an owner may revoke any key of the
 * workspace; 404 for an unknown key, another workspace's, or a colleague's key when the caller is not an owner.
 */
export const DELETE = workspaceRoute({ minimumRole: "viewer", sessionOnly: true }, async ({ access, params }) => {
  await revokeApiKey(access, params.keyId);
  return new Response(null, { status: 204 });
});
