import type { Metadata } from "next";
import { RevisionView } from "@/components/fits/revision-view";
import { PageHeader } from "@/components/ui";
import { hasRole } from "@/lib/auth/roles";
import { requireFitRevisions } from "@/lib/server/fits/fit-page-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Revision" };

export default async function RevisionPage({ params }: { params: Promise<{ slug: string; fitId: string; n: string }> }) {
  const { slug, fitId, n } = await params;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  const [number] = await requireFitRevisions(workspace.id, fitId, [n]);
  return (
    <>
      <PageHeader title={`Revision ${number}`} />
      <RevisionView slug={workspace.slug} fitId={fitId} number={number} canEdit={hasRole(role, "editor")} />
    </>
  );
}
