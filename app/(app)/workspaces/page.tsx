import type { Metadata } from "next";
import Link from "next/link";
import { CreateWorkspaceForm } from "@/components/workspaces/create-workspace-form";
import { formatDate } from "@/components/format";
import { EmptyState, PageHeader, Panel, RoleBadge } from "@/components/ui";
import { listWorkspacesForUser } from "@/db/queries/workspaces";
import { requireUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Workspaces" };

export default async function WorkspacesPage() {
  const user = await requireUser("/workspaces");
  const workspaces = await listWorkspacesForUser(user.id);
  return (
    <main className="mx-auto max-w-page px-4 py-8">
      <PageHeader title="Your workspaces" description="A workspace holds one team's datasets, models and fits." />
      <div className="grid items-start gap-6 lg:grid-cols-[1fr_22rem]">
        <section aria-labelledby="workspace-list-heading">
          <h2 id="workspace-list-heading" className="sr-only">
            Workspaces you belong to
          </h2>
          {workspaces.length === 0 ? (
            <EmptyState
              title="You are not in a workspace yet"
              description="Create one for your lab or project with the form beside this, or ask a colleague to invite you — the invitation arrives by e-mail."
            />
          ) : (
            <ul className="divide-y divide-line rounded-lg border border-line bg-surface shadow-sm">
              {workspaces.map((workspace) => (
                <li key={workspace.slug} className="flex items-center justify-between gap-4 px-4 py-3">
                  <div className="min-w-0">
                    <Link href={`/w/${workspace.slug}`} className="font-medium">
                      {workspace.name}
                    </Link>
                    <p className="text-xs text-ink-faint">Created {formatDate(workspace.createdAt)}</p>
                  </div>
                  <RoleBadge role={workspace.role} />
                </li>
              ))}
            </ul>
          )}
        </section>
        <Panel title="New workspace">
          <CreateWorkspaceForm />
        </Panel>
      </div>
    </main>
  );
}
