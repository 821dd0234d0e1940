import { workspaceRoute } from "@/lib/server/route";
import { cancelInvitation } from "@/lib/server/workspaces";

/** Withdraws a pending invitation (owners only) → 204; its link then says the invitation is closed. */
export const DELETE = workspaceRoute({ minimumRole: "owner" }, async ({ access, params }) => {
  await cancelInvitation(access, { invitationId: params.invitationId });
  return new Response(null, { status: 204 });
});
