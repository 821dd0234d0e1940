import { randomUUID } from "node:crypto";
import { getUserById } from "@/db/queries/users";
import {
  countOwners,
  deleteInvitation,
  deleteMember,
  hasPendingInvitation,
  insertInvitation,
  isEmailMember,
  updateMemberRole,
} from "@/db/queries/memberships";
import { getMemberInWorkspace, type WorkspaceSummary } from "@/db/queries/workspaces";
import { auth, invitationUrl } from "@/lib/auth/server";
import { invitationMessage } from "@/lib/email/messages";
import { sendMail } from "@/lib/email/send";
import type { ChangeMemberRoleInput, InviteMemberInput, RemoveMemberInput } from "@/lib/schemas/workspaces";
import { AppError } from "./errors";
import type { WorkspaceAccess } from "./workspace-access";
import { workspaceSlugFor } from "./workspace-slug";

/** How long an invitation link stays valid, seconds (7 days). */
export const invitationLifetimeSeconds = 7 * 24 * 60 * 60;

/** Creates a workspace with `userId` as its owner. */
export async function createWorkspace(params: { userId: string; name: string }): Promise<WorkspaceSummary> {
  const created = await auth.api.createOrganization({
    body: { name: params.name, slug: workspaceSlugFor(params.name), userId: params.userId },
  });
  if (!created) throw new AppError("internal", "The workspace could not be created.");
  return { id: created.id, slug: created.slug, name: created.name };
}

/** Stores an invitation and mails its link; nothing is stored when the mail cannot be sent. */
export async function inviteMember(access: WorkspaceAccess, input: InviteMemberInput): Promise<{ id: string; email: string; role: string; expiresAt: Date }> {
  const { workspace } = access;
  if (await isEmailMember({ workspaceId: workspace.id, email: input.email })) {
    throw new AppError("conflict", "That person is already a member of this workspace.");
  }
  if (await hasPendingInvitation({ workspaceId: workspace.id, email: input.email })) {
    throw new AppError("conflict", "That address already has a pending invitation.");
  }
  const inviter = await getUserById(access.user.id);
  if (!inviter) throw new AppError("unauthenticated");
  const id = randomUUID();
  const expiresAt = new Date(Date.now() + invitationLifetimeSeconds * 1000);
  await insertInvitation({
    id,
    organizationId: workspace.id,
    email: input.email,
    role: input.role,
    status: "pending",
    expiresAt,
    inviterId: inviter.id,
  });
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

async function requireOtherOwnerIfOwner(workspaceId: string, currentRole: string): Promise<void> {
  if (currentRole === "owner" && (await countOwners(workspaceId)) <= 1) {
    throw new AppError("conflict", "A workspace needs at least one owner; make someone else owner first.");
  }
}

async function requireMember(workspaceId: string, memberId: string) {
  const target = await getMemberInWorkspace({ workspaceId, memberId });
  if (!target) throw new AppError("not_found", "No such member in this workspace.");
  return target;
}

export async function changeMemberRole(access: WorkspaceAccess, input: ChangeMemberRoleInput): Promise<void> {
  const target = await requireMember(access.workspace.id, input.memberId);
  if (target.role === input.role) return;
  await requireOtherOwnerIfOwner(access.workspace.id, target.role);
  await updateMemberRole({ workspaceId: access.workspace.id, memberId: input.memberId, role: input.role });
}

export async function removeMember(access: WorkspaceAccess, input: RemoveMemberInput): Promise<void> {
  const target = await requireMember(access.workspace.id, input.memberId);
  await requireOtherOwnerIfOwner(access.workspace.id, target.role);
  await deleteMember({ workspaceId: access.workspace.id, memberId: input.memberId });
}
