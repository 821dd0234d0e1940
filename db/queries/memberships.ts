import { and, eq, gt, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invitation, member, user } from "@/db/schema";
import type { WorkspaceRole } from "@/lib/auth/roles";

/** What happened to a role change or removal; "last-owner" means nothing changed. */
export type MemberChange = "done" | "not-found" | "last-owner";

// The "at least one owner" rule lives inside the one statement that changes the row, so two owners who
// demote or remove each other at the same moment cannot both pass it. The workspace's owner rows are
// locked first (FOR UPDATE), so the second statement waits and then counts the first one's result.
const otherOwnerRemains = (workspaceId: string, memberId: string) => sql`(
  ${member.role} <> 'owner' or exists (
    select 1 from (
      select ${member.id} as id from ${member}
      where ${member.organizationId} = ${workspaceId} and ${member.role} = 'owner' for update
    ) as owners where owners.id <> ${memberId}
  )
)`;

async function outcome(changed: { id: string }[], workspaceId: string, memberId: string): Promise<MemberChange> {
  if (changed.length > 0) return "done";
  const exists = await db
    .select({ id: member.id })
    .from(member)
    .where(and(eq(member.organizationId, workspaceId), eq(member.id, memberId)))
    .limit(1);
  return exists.length > 0 ? "last-owner" : "not-found";
}

/** Sets a member's role unless that would leave the workspace without an owner. */
export async function updateMemberRole(params: { workspaceId: string; memberId: string; role: WorkspaceRole }): Promise<MemberChange> {
  const { workspaceId, memberId, role } = params;
  const keepsAnOwner = role === "owner" ? sql`true` : otherOwnerRemains(workspaceId, memberId);
  const changed = await db
    .update(member)
    .set({ role })
    .where(and(eq(member.organizationId, workspaceId), eq(member.id, memberId), keepsAnOwner))
    .returning({ id: member.id });
  return outcome(changed, workspaceId, memberId);
}

/** Removes a member unless they are the workspace's last owner. */
export async function deleteMember(params: { workspaceId: string; memberId: string }): Promise<MemberChange> {
  const { workspaceId, memberId } = params;
  const changed = await db
    .delete(member)
    .where(and(eq(member.organizationId, workspaceId), eq(member.id, memberId), otherOwnerRemains(workspaceId, memberId)))
    .returning({ id: member.id });
  return outcome(changed, workspaceId, memberId);
}

type InvitationRow = typeof invitation.$inferInsert;

/**
 * Stores an invitation unless the address already belongs to a member or has a pending, unexpired
 * invitation. The check and the insert run in one transaction under a lock on the workspace's
 * invitations, so two owners inviting the same address at once store one invitation, not two.
 */
export async function insertInvitationIfNew(row: InvitationRow & { email: string }): Promise<"stored" | "member" | "pending"> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`invitations|${row.organizationId}`}))`);
    const isMember = await tx
      .select({ id: member.id })
      .from(member)
      .innerJoin(user, eq(member.userId, user.id))
      .where(and(eq(member.organizationId, row.organizationId), eq(user.email, row.email)))
      .limit(1);
    if (isMember.length > 0) return "member";
    const pending = await tx
      .select({ id: invitation.id })
      .from(invitation)
      .where(
        and(
          eq(invitation.organizationId, row.organizationId),
          eq(invitation.email, row.email),
          eq(invitation.status, "pending"),
          gt(invitation.expiresAt, new Date()),
        ),
      )
      .limit(1);
    if (pending.length > 0) return "pending";
    await tx.insert(invitation).values(row);
    return "stored";
  });
}

export async function deleteInvitation(id: string): Promise<void> {
  await db.delete(invitation).where(eq(invitation.id, id));
}

/**
 * Withdraws a pending invitation of this workspace (its link stops working; the row stays as "canceled",
 * better-auth's own status word).
 * @returns false when no pending invitation with that id belongs to the workspace
 */
export async function cancelPendingInvitation(params: { workspaceId: string; invitationId: string }): Promise<boolean> {
  const changed = await db
    .update(invitation)
    .set({ status: "canceled" })
    .where(
      and(
        eq(invitation.organizationId, params.workspaceId),
        eq(invitation.id, params.invitationId),
        eq(invitation.status, "pending"),
      ),
    )
    .returning({ id: invitation.id });
  return changed.length > 0;
}
