import { NextResponse } from "next/server";
import { inviteMemberInput } from "@/lib/schemas/workspaces";
import { workspaceRoute } from "@/lib/server/route";
import { inviteMember } from "@/lib/server/workspaces";

/** Invites by e-mail (owners only): `{ "email", "role" }` → 201 `{ id, email, role, expiresAt }`; the link is mailed. */
export const POST = workspaceRoute({ minimumRole: "owner", input: inviteMemberInput }, async ({ access, input }) => {
  const invitation = await inviteMember(access, input);
  return NextResponse.json(invitation, { status: 201 });
});
