import type { Metadata } from "next";
import { RevisionsList } from "@/components/fits/revisions-list";
import { PageHeader } from "@/components/ui";
import { requireFitRevisions } from "@/lib/server/fits/fit-page-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Fit" };

export default async function FitPage({ params }: { params: Promise<{ slug: string; fitId: string }> }) {
  const { slug, fitId } = await params;
  const { workspace } = await requireWorkspaceMember(slug, "viewer");
  await requireFitRevisions(workspace.id, fitId);
  return (
    <>
      <PageHeader title="Fit revisions" description="Every launch of this fit, oldest first. Open one to inspect it, or compare two." />
      <RevisionsList slug={workspace.slug} fitId={fitId} />
    </>
  );
}
