import type { Metadata } from "next";
import { formatDateTime } from "@/components/format";
import { InviteMemberForm } from "@/components/workspaces/invite-member-form";
import { MembersTable } from "@/components/workspaces/members-table";
import { PageHeader, Panel, RoleBadge } from "@/components/ui";
import { listMembers, listPendingInvitations } from "@/db/queries/workspaces";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Members" };

export default async function MembersPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { workspace, role, memberId } = await requireWorkspaceMember(slug, "viewer");
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
      <div className={isOwner ? "grid items-start gap-6 lg:grid-cols-[1fr_22rem]" : undefined}>
        <div className="flex flex-col gap-6">
          <Panel title="People" flush>
            <MembersTable members={members} manage={isOwner ? { slug: workspace.slug, ownMemberId: memberId } : undefined} />
          </Panel>
          {isOwner ? (
            <Panel title="Pending invitations" flush>
              {invitations.length === 0 ? (
                <p className="px-4 py-3 text-sm text-ink-muted">No invitations are waiting for an answer.</p>
              ) : (
                <table className="w-full text-sm">
                  <caption className="sr-only">Invitations waiting for an answer</caption>
                  <thead className="bg-surface-sunken text-left text-xs uppercase tracking-wide text-ink-muted">
                    <tr>
                      <th scope="col" className="px-4 py-2 font-semibold">E-mail</th>
                      <th scope="col" className="px-4 py-2 font-semibold">Role</th>
                      <th scope="col" className="px-4 py-2 font-semibold">Expires</th>
                    </tr>
                  </thead>
                  <tbody>
                    {invitations.map((invitation) => (
                      <tr key={invitation.id} className="border-t border-line">
                        <td className="px-4 py-2">{invitation.email}</td>
                        <td className="px-4 py-2">
                          <RoleBadge role={invitation.role} />
                        </td>
                        <td className="px-4 py-2 tabular-nums text-ink-muted">{formatDateTime(invitation.expiresAt)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              )}
            </Panel>
          ) : null}
        </div>
        {isOwner ? (
          <Panel title="Invite a colleague">
            <InviteMemberForm slug={workspace.slug} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
