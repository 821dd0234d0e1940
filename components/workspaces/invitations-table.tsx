"use client";

import { useMemo } from "react";
import { formatDateTime } from "@/components/format";
import { DataTable, dataColumnHelper, RoleBadge } from "@/components/ui";
import type { PendingInvitationListRow } from "@/db/queries/workspaces";
import { CancelInvitationButton } from "./cancel-invitation-button";

/** One invitation still waiting for an answer. */
export type PendingInvitationRow = PendingInvitationListRow;

const helper = dataColumnHelper<PendingInvitationRow>();

const baseColumns = helper.columns([
  helper.accessor("email", { header: "E-mail", sortFn: "text" }),
  helper.accessor("role", { header: "Role", cell: (info) => <RoleBadge role={info.getValue()} />, sortFn: "text" }),
  helper.accessor("expiresAt", {
    header: "Expires",
    cell: (info) => formatDateTime(info.getValue()),
    sortFn: "datetime",
    meta: { figures: true },
  }),
]);

/** Owner-only list of invitations that have not been accepted yet, each with a "Withdraw" control. */
export function InvitationsTable({ slug, invitations }: { slug: string; invitations: PendingInvitationRow[] }) {
  const columns = useMemo(
    () => [
      ...baseColumns,
      helper.display({
        id: "actions",
        header: "",
        meta: { srHeader: "Actions", alignEnd: true },
        cell: ({ row }) => <CancelInvitationButton slug={slug} invitationId={row.original.id} email={row.original.email} />,
      }),
    ],
    [slug],
  );
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
