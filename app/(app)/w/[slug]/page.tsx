import type { Metadata } from "next";
import Link from "next/link";
import { ButtonLink, EmptyState, PageHeader, Panel } from "@/components/ui";
import { listMembers } from "@/db/queries/workspaces";
import { hasRole } from "@/lib/auth/roles";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Workspace" };

export default async function WorkspaceHomePage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  const members = await listMembers(workspace.id);
  const base = `/w/${workspace.slug}`;
  const canEdit = hasRole(role, "editor");

  // Datasets and fits arrive with later features; until then every workspace starts empty, and the
  // empty states say what to do first.
  return (
    <>
      <PageHeader title="Overview" description="Band data, tight-binding models and fits of this workspace." />
      <div className="grid gap-6 md:grid-cols-2">
        <Panel title="Datasets" description="Band energies from DFT or ARPES, kept byte for byte.">
          <EmptyState
            title="No datasets yet"
            description={
              canEdit
                ? "Upload a CSV or TSV of band energies along a k-path (DFT) or peak positions with error bars (ARPES) to begin."
                : "An editor or owner uploads band data here; you will see it as soon as it arrives."
            }
            action={
              <ButtonLink href={`${base}/datasets`} variant={canEdit ? "primary" : "secondary"}>
                {canEdit ? "Upload a dataset" : "Open datasets"}
              </ButtonLink>
            }
          />
        </Panel>
        <Panel title="Fits" description="Tight-binding parameters fitted to a dataset, revision by revision.">
          <EmptyState
            title="No fits yet"
            description={
              canEdit
                ? "Once a dataset is in, pick a model template, choose the free parameters and launch a fit."
                : "Fits launched by editors appear here with χ², RMS per band and parameters ± errors."
            }
            action={
              <ButtonLink href={`${base}/fits`} variant="secondary">
                {canEdit ? "Start a fit" : "Open fits"}
              </ButtonLink>
            }
          />
        </Panel>
      </div>
      <p className="mt-6 text-sm text-ink-muted">
        <span className="tabular-nums">{members.length}</span> {members.length === 1 ? "member" : "members"} ·{" "}
        <Link href={`${base}/members`}>{role === "owner" ? "Manage members" : "See members"}</Link>
      </p>
    </>
  );
}
