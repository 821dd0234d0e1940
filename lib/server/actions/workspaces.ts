"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { getInvitation } from "@/db/queries/workspaces";
import { auth } from "@/lib/auth/server";
import {
  acceptInvitationInput,
  cancelInvitationInput,
  changeMemberRoleInput,
  createWorkspaceInput,
  inviteMemberInput,
  removeMemberInput,
} from "@/lib/schemas/workspaces";
import { userAction, workspaceAction } from "../action";
import { AppError } from "../errors";
import { cancelInvitation, changeMemberRole, createWorkspace, inviteMember, removeMember } from "../workspaces";

const membersPath = (slug: string) => `/w/${slug}/members`;

export const createWorkspaceAction = userAction({ input: createWorkspaceInput }, async ({ principal, input }) => {
  const workspace = await createWorkspace({ userId: principal.user.id, name: input.name });
  revalidatePath("/workspaces");
  redirect(`/w/${workspace.slug}`);
});

export const inviteMemberAction = workspaceAction(
  { input: inviteMemberInput, minimumRole: "owner" },
  async ({ access, input }) => {
    await inviteMember(access, input);
    revalidatePath(membersPath(access.workspace.slug));
    return { ok: true, message: `Invitation sent to ${input.email}.` };
  },
);

export const changeMemberRoleAction = workspaceAction(
  { input: changeMemberRoleInput, minimumRole: "owner" },
  async ({ access, input }) => {
    await changeMemberRole(access, input);
    revalidatePath(membersPath(access.workspace.slug));
    return { ok: true, message: "Role changed." };
  },
);

export const removeMemberAction = workspaceAction(
  { input: removeMemberInput, minimumRole: "owner" },
  async ({ access, input }) => {
    await removeMember(access, input);
    revalidatePath(membersPath(access.workspace.slug));
    return { ok: true, message: "Member removed." };
  },
);

export const cancelInvitationAction = workspaceAction(
  { input: cancelInvitationInput, minimumRole: "owner" },
  async ({ access, input }) => {
    await cancelInvitation(access, input);
    revalidatePath(membersPath(access.workspace.slug));
    return { ok: true, message: "Invitation withdrawn." };
  },
);

/** Accepting needs the browser session (better-auth checks the invitee's e-mail against the invitation). */
export const acceptInvitationAction = userAction({ input: acceptInvitationInput }, async ({ principal, input }) => {
  if (principal.via !== "session") throw new AppError("forbidden", "Invitations are accepted in the browser.");
  const invitation = await getInvitation(input.invitationId);
  if (!invitation) throw new AppError("not_found", "This invitation does not exist.");
  if (invitation.email !== principal.user.email.toLowerCase()) {
    throw new AppError("forbidden", `This invitation is for ${invitation.email}; sign in with that address.`);
  }
  if (invitation.status !== "pending" || invitation.expiresAt <= new Date()) {
    throw new AppError("conflict", "This invitation is no longer valid; ask for a new one.");
  }
  await auth.api.acceptInvitation({ body: { invitationId: input.invitationId }, headers: await headers() });
  revalidatePath("/workspaces");
  redirect(`/w/${invitation.workspaceSlug}`);
});
