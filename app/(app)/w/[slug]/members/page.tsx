import type { Metadata } from "next";
import { InvitationsTable } from "@/components/workspaces/invitations-table";
import { InviteMemberForm } from "@/components/workspaces/invite-member-form";
import { MembersTable } from "@/components/workspaces/members-table";
import { PageHeader, Panel } from "@/components/ui";
import { listMembers, listPendingInvitations } from "@/db/queries/workspaces";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Members" };

export default async function MembersPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { workspace, role, memberId } = await requireWorkspaceMember(slug, "viewer", `/w/${encodeURIComponent(slug)}/members`);
  const isOwner = role === "owner";
  const [members, invitations] = await Promise.all([
    listMembers(workspace.id),
    isOwner ? listPendingInvitations(workspace.id) : Promise.resolve([]),
  ]);

  return (
    <>
      <PageHeader
        title="Members"
        description={
          isOwner
            ? "Invite colleagues, change their roles or remove them. Editors upload data and launch fits; viewers read and export."
            : "Who works in this workspace. Only owners invite people and change roles."
        }
      />
      <div className="flex flex-col gap-6">
        {isOwner ? (
          <Panel title="Invite a colleague">
            <InviteMemberForm slug={workspace.slug} />
          </Panel>
        ) : null}
        <Panel title="People" flush>
          <MembersTable members={members} manage={isOwner ? { slug: workspace.slug, ownMemberId: memberId } : undefined} />
        </Panel>
        {isOwner ? (
          <Panel title="Pending invitations" flush>
            <InvitationsTable slug={workspace.slug} invitations={invitations} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
