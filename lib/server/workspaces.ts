import { randomUUID } from "node:crypto";
import {
  cancelPendingInvitation,
  deleteInvitation,
  deleteMember,
  insertInvitationIfNew,
  type MemberChange,
  updateMemberRole,
} from "@/db/queries/memberships";
import type { WorkspaceSummary } from "@/db/queries/workspaces";
import { auth, invitationLifetimeSeconds, invitationUrl } from "@/lib/auth/server";
import { invitationMessage } from "@/lib/email/messages";
import { sendMail } from "@/lib/email/send";
import type {
  CancelInvitationInput,
  ChangeMemberRoleInput,
  InviteMemberInput,
  RemoveMemberInput,
} from "@/lib/schemas/workspaces";
import { AppError } from "./errors";
import type { WorkspaceAccess } from "./workspace-access";
import { workspaceSlugFor } from "./workspace-slug";

/** Creates a workspace with `userId` as its owner. */
export async function createWorkspace(params: { userId: string; name: string }): Promise<WorkspaceSummary> {
  const created = await auth.api.createOrganization({
    body: { name: params.name, slug: workspaceSlugFor(params.name), userId: params.userId },
  });
  if (!created) throw new AppError("internal", "The workspace could not be created.");
  return { id: created.id, slug: created.slug, name: created.name };
}

/**
 * The one way an invitation is made (better-auth's invite endpoint is switched off): stores it and mails
 * its link; nothing is stored when the mail cannot be sent.
 */
export async function inviteMember(access: WorkspaceAccess, input: InviteMemberInput): Promise<{ id: string; email: string; role: string; expiresAt: Date }> {
  const { workspace, user: inviter } = access;
  const id = randomUUID();
  const expiresAt = new Date(Date.now() + invitationLifetimeSeconds * 1000);
  const stored = await insertInvitationIfNew({
    id,
    organizationId: workspace.id,
    email: input.email,
    role: input.role,
    status: "pending",
    expiresAt,
    inviterId: inviter.id,
  });
  if (stored === "member") throw new AppError("conflict", "That person is already a member of this workspace.");
  if (stored === "pending") {
    throw new AppError("conflict", "That address already has a pending invitation; withdraw it first to send a new one.");
  }
  try {
    await sendMail(
      invitationMessage({
        to: input.email,
        workspaceName: workspace.name,
        inviterName: inviter.name,
        role: input.role,
        acceptUrl: invitationUrl(id),
      }),
    );
  } catch (cause) {
    await deleteInvitation(id);
    throw new AppError("unavailable", "The invitation e-mail could not be sent; nothing was stored.", { cause });
  }
  return { id, email: input.email, role: input.role, expiresAt };
}

/** Withdraws a pending invitation; its link then says the invitation is closed. */
export async function cancelInvitation(access: WorkspaceAccess, input: CancelInvitationInput): Promise<void> {
  const cancelled = await cancelPendingInvitation({ workspaceId: access.workspace.id, invitationId: input.invitationId });
  if (!cancelled) throw new AppError("not_found", "No pending invitation with that id in this workspace.");
}

function requireDone(change: MemberChange): void {
  if (change === "not-found") throw new AppError("not_found", "No such member in this workspace.");
  if (change === "last-owner") {
    throw new AppError("conflict", "A workspace needs at least one owner; make someone else owner first.");
  }
}

export async function changeMemberRole(access: WorkspaceAccess, input: ChangeMemberRoleInput): Promise<void> {
  requireDone(await updateMemberRole({ workspaceId: access.workspace.id, memberId: input.memberId, role: input.role }));
}

export async function removeMember(access: WorkspaceAccess, input: RemoveMemberInput): Promise<void> {
  requireDone(await deleteMember({ workspaceId: access.workspace.id, memberId: input.memberId }));
}
