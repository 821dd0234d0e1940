"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { formatDateTime } from "@/components/format";
import { Button, DataTable, RoleBadge, dataColumnHelper } from "@/components/ui";
import type { WorkspaceRole } from "@/lib/auth/roles";
import { KeyRequestError, requestRevocation } from "./api-key-requests";

/** One key as the API keys page lists it (never its text or hash). */
export interface ApiKeyRow {
  id: string;
  label: string;
  prefix: string;
  role: WorkspaceRole;
  creatorName: string;
  createdByYou: boolean;
  createdAt: Date;
  lastUsedAt: Date | null;
}

function RevokeButton({ slug, row }: { slug: string; row: ApiKeyRow }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  async function revoke() {
    if (!window.confirm(`Revoke the key "${row.label}"? Scripts using it stop working at once.`)) return;
    setPending(true);
    try {
      await requestRevocation(slug, row.id);
      router.refresh();
    } catch (error) {
      setProblem(error instanceof KeyRequestError ? error.message : "The key could not be revoked; try again.");
    } finally {
      setPending(false);
    }
  }
  return (
    <div className="flex flex-col items-end gap-1">
      <Button size="sm" variant="danger" onClick={revoke} disabled={pending} aria-disabled={pending}>
        {pending ? "Revoking…" : <span>Revoke<span className="sr-only"> the key {row.label}</span></span>}
      </Button>
      {problem ? (
        <p role="alert" className="text-xs text-danger-700">
          {problem}
        </p>
      ) : null}
    </div>
  );
}

const helper = dataColumnHelper<ApiKeyRow>();

const baseColumns = helper.columns([
  helper.accessor("label", { header: "Name", sortFn: "text" }),
  helper.accessor("prefix", { header: "Begins with", cell: (info) => <code className="font-mono text-xs">{info.getValue()}…</code>, enableSorting: false }),
  helper.accessor("role", { header: "Role", cell: (info) => <RoleBadge role={info.getValue()} />, sortFn: "text" }),
  helper.accessor("creatorName", { header: "Created by", cell: (info) => (info.row.original.createdByYou ? "you" : info.getValue()), sortFn: "text" }),
  helper.accessor("createdAt", { header: "Created", cell: (info) => formatDateTime(info.getValue()), sortFn: "datetime", meta: { figures: true } }),
  helper.accessor("lastUsedAt", {
    header: "Last used",
    cell: (info) => {
      const value = info.getValue();
      return value ? formatDateTime(value) : "never";
    },
    sortFn: "datetime",
    meta: { figures: true },
  }),
]);

/** The keys a member may manage, each with a revoke button. */
export function ApiKeysTable({ slug, keys }: { slug: string; keys: ApiKeyRow[] }) {
  const columns = useMemo(
    () => [
      ...baseColumns,
      helper.display({ id: "revoke", header: "", meta: { srHeader: "Actions", alignEnd: true }, cell: ({ row }) => <RevokeButton slug={slug} row={row.original} /> }),
    ],
    [slug],
  );
  return <DataTable columns={columns} data={keys} caption="API keys" captionHidden empty="No keys yet; create one above." getRowId={(key) => key.id} />;
}
