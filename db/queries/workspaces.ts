import { and, asc, eq, gt } from "drizzle-orm";
import { db } from "@/db/client";
import { invitation, member, organization, user, type Workspace } from "@/db/schema";
import { type WorkspaceRole, isWorkspaceRole } from "@/lib/auth/roles";

// Roles are stored as text by better-auth; only our three are ever written, so anything else is corruption.
function storedRole(value: string | null): WorkspaceRole {
  if (value !== null && isWorkspaceRole(value)) return value;
  throw new Error(`Unknown workspace role in the database: ${String(value)}`);
}

/** A workspace row as the web layer uses it. */
export type WorkspaceSummary = Pick<Workspace, "id" | "slug" | "name">;

export async function getWorkspaceBySlug(slug: string): Promise<WorkspaceSummary | null> {
  const rows = await db
    .select({ id: organization.id, slug: organization.slug, name: organization.name })
    .from(organization)
    .where(eq(organization.slug, slug))
    .limit(1);
  return rows[0] ?? null;
}

/** The user's membership row in a workspace, or null when they are not a member. */
export async function getMembership(params: { workspaceId: string; userId: string }) {
  const rows = await db
    .select({ memberId: member.id, role: member.role })
    .from(member)
    .where(and(eq(member.organizationId, params.workspaceId), eq(member.userId, params.userId)))
    .limit(1);
  const row = rows[0];
  return row ? { memberId: row.memberId, role: storedRole(row.role) } : null;
}

export async function listWorkspacesForUser(userId: string) {
  return db
    .select({
      id: organization.id,
      slug: organization.slug,
      name: organization.name,
      role: member.role,
      createdAt: organization.createdAt,
    })
    .from(member)
    .innerJoin(organization, eq(member.organizationId, organization.id))
    .where(eq(member.userId, userId))
    .orderBy(asc(organization.name))
    .then((rows) => rows.map((row) => ({ ...row, role: storedRole(row.role) })));
}

export async function listMembers(workspaceId: string) {
  return db
    .select({
      memberId: member.id,
      userId: user.id,
      name: user.name,
      email: user.email,
      role: member.role,
      joinedAt: member.createdAt,
    })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .where(eq(member.organizationId, workspaceId))
    .orderBy(asc(member.createdAt))
    .then((rows) => rows.map((row) => ({ ...row, role: storedRole(row.role) })));
}

/** Invitations still waiting for an answer and not yet expired. */
export async function listPendingInvitations(workspaceId: string) {
  return db
    .select({ id: invitation.id, email: invitation.email, role: invitation.role, expiresAt: invitation.expiresAt })
    .from(invitation)
    .where(
      and(
        eq(invitation.organizationId, workspaceId),
        eq(invitation.status, "pending"),
        gt(invitation.expiresAt, new Date()),
      ),
    )
    .orderBy(asc(invitation.createdAt))
    .then((rows) => rows.map((row) => ({ ...row, role: storedRole(row.role) })));
}

/** One invitation with what its page shows, or null when the id is unknown. */
export async function getInvitation(id: string) {
  const rows = await db
    .select({
      id: invitation.id,
      email: invitation.email,
      role: invitation.role,
      status: invitation.status,
      expiresAt: invitation.expiresAt,
      workspaceSlug: organization.slug,
      workspaceName: organization.name,
      inviterName: user.name,
    })
    .from(invitation)
    .innerJoin(organization, eq(invitation.organizationId, organization.id))
    .innerJoin(user, eq(invitation.inviterId, user.id))
    .where(eq(invitation.id, id))
    .limit(1);
  const row = rows[0];
  return row ? { ...row, role: storedRole(row.role) } : null;
}

/** One row of listMembers (the members table's row type). */
export type MemberListRow = Awaited<ReturnType<typeof listMembers>>[number];
/** One row of listPendingInvitations (the invitations table's row type). */
export type PendingInvitationListRow = Awaited<ReturnType<typeof listPendingInvitations>>[number];
