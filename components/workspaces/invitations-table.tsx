"use client";

import { formatDateTime } from "@/components/format";
import { DataTable, dataColumnHelper, RoleBadge } from "@/components/ui";
import type { WorkspaceRole } from "@/lib/auth/roles";

/** One invitation still waiting for an answer. */
export interface PendingInvitationRow {
  id: string;
  email: string;
  role: WorkspaceRole;
  expiresAt: Date;
}

const helper = dataColumnHelper<PendingInvitationRow>();

const columns = helper.columns([
  helper.accessor("email", { header: "E-mail", sortFn: "text" }),
  helper.accessor("role", { header: "Role", cell: (info) => <RoleBadge role={info.getValue()} />, sortFn: "text" }),
  helper.accessor("expiresAt", {
    header: "Expires",
    cell: (info) => formatDateTime(info.getValue()),
    sortFn: "datetime",
    meta: { figures: true },
  }),
]);

/** Owner-only list of invitations that have not been accepted yet. */
export function InvitationsTable({ invitations }: { invitations: PendingInvitationRow[] }) {
  return (
    <DataTable
      columns={columns}
      data={invitations}
      caption="Invitations waiting for an answer"
      captionHidden
      getRowId={(invitation) => invitation.id}
      empty="No invitations are waiting for an answer."
    />
  );
}
