import type { Metadata } from "next";
import { NewRevisionForm } from "@/components/fits/new-revision-form";
import { PageHeader } from "@/components/ui";
import { requireFitRevisions } from "@/lib/server/fits/fit-page-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "New revision" };

export default async function NewRevisionPage({ params, searchParams }: { params: Promise<{ slug: string; fitId: string }>; searchParams: Promise<{ from?: string | string[] }> }) {
  const { slug, fitId } = await params;
  const { workspace } = await requireWorkspaceMember(slug, "editor");
  const [from] = await requireFitRevisions(workspace.id, fitId, [(await searchParams).from]);
  return (
    <>
      <PageHeader title={`New revision from revision ${from}`} description="Free or fix parameters, change the window or the weights, and launch again." />
      <NewRevisionForm slug={workspace.slug} fitId={fitId} from={from} />
    </>
  );
}
