import { and, count, eq, gt } from "drizzle-orm";
import { db } from "@/db/client";
import { invitation, member, user } from "@/db/schema";
import type { WorkspaceRole } from "@/lib/auth/roles";

export async function countOwners(workspaceId: string): Promise<number> {
  const rows = await db
    .select({ owners: count() })
    .from(member)
    .where(and(eq(member.organizationId, workspaceId), eq(member.role, "owner")));
  return rows[0]?.owners ?? 0;
}

export async function updateMemberRole(params: { workspaceId: string; memberId: string; role: WorkspaceRole }) {
  await db
    .update(member)
    .set({ role: params.role })
    .where(and(eq(member.organizationId, params.workspaceId), eq(member.id, params.memberId)));
}

export async function deleteMember(params: { workspaceId: string; memberId: string }) {
  await db.delete(member).where(and(eq(member.organizationId, params.workspaceId), eq(member.id, params.memberId)));
}

/** True when a user with this e-mail is already a member of the workspace. */
export async function isEmailMember(params: { workspaceId: string; email: string }): Promise<boolean> {
  const rows = await db
    .select({ id: member.id })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .where(and(eq(member.organizationId, params.workspaceId), eq(user.email, params.email)))
    .limit(1);
  return rows.length > 0;
}

export async function hasPendingInvitation(params: { workspaceId: string; email: string }): Promise<boolean> {
  const rows = await db
    .select({ id: invitation.id })
    .from(invitation)
    .where(
      and(
        eq(invitation.organizationId, params.workspaceId),
        eq(invitation.email, params.email),
        eq(invitation.status, "pending"),
        gt(invitation.expiresAt, new Date()),
      ),
    )
    .limit(1);
  return rows.length > 0;
}

export async function insertInvitation(row: typeof invitation.$inferInsert): Promise<void> {
  await db.insert(invitation).values(row);
}

export async function deleteInvitation(id: string): Promise<void> {
  await db.delete(invitation).where(eq(invitation.id, id));
}
