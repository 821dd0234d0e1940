"use client";

import { useMemo } from "react";
import { formatDate } from "@/components/format";
import { DataTable, dataColumnHelper, RoleBadge } from "@/components/ui";
import type { MemberListRow } from "@/db/queries/workspaces";
import { MemberActions } from "./member-actions";

/** One member as the members page shows them. */
export type MemberRow = MemberListRow;

const helper = dataColumnHelper<MemberRow>();

const baseColumns = helper.columns([
  helper.accessor("name", { header: "Name", sortFn: "text" }),
  helper.accessor("email", { header: "E-mail", sortFn: "text" }),
  helper.accessor("role", { header: "Role", cell: (info) => <RoleBadge role={info.getValue()} />, sortFn: "text" }),
  helper.accessor("joinedAt", {
    header: "Joined",
    cell: (info) => formatDate(info.getValue()),
    sortFn: "datetime",
    meta: { figures: true },
  }),
]);

interface MembersTableProps {
  members: MemberRow[];
  /** Set for owners: rows other than their own get role and remove controls. */
  manage?: { slug: string; ownMemberId: string };
}

/** The members of a workspace with their roles; owners also manage them here. */
export function MembersTable({ members, manage }: MembersTableProps) {
  const slug = manage?.slug;
  const ownMemberId = manage?.ownMemberId;
  const columns = useMemo(() => {
    if (slug === undefined) return baseColumns;
    return [
        ...baseColumns,
        helper.display({
          id: "actions",
          header: "",
          meta: { srHeader: "Actions", alignEnd: true },
          cell: ({ row }) =>
            row.original.memberId === ownMemberId ? (
              <span className="text-xs text-ink-faint">You</span>
            ) : (
              <MemberActions
                slug={slug}
                memberId={row.original.memberId}
                name={row.original.name}
                role={row.original.role}
              />
            ),
        }),
    ];
  }, [slug, ownMemberId]);
  return (
    <DataTable
      columns={columns}
      data={members}
      caption="Workspace members"
      captionHidden
      getRowId={(member) => member.memberId}
    />
  );
}
