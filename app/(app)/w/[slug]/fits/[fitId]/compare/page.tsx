import type { Metadata } from "next";
import { CompareView } from "@/components/fits/compare-view";
import { PageHeader } from "@/components/ui";
import { requireFitRevisions } from "@/lib/server/fits/fit-page-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Compare revisions" };

export default async function ComparePage({ params, searchParams }: { params: Promise<{ slug: string; fitId: string }>; searchParams: Promise<{ a?: string | string[]; b?: string | string[] }> }) {
  const { slug, fitId } = await params;
  const query = await searchParams;
  const { workspace } = await requireWorkspaceMember(slug, "viewer");
  const [a, b] = await requireFitRevisions(workspace.id, fitId, [query.a, query.b]);
  return (
    <>
      <PageHeader title={`Revision ${a} and revision ${b}`} description="A is the first revision, B the second." />
      <CompareView slug={workspace.slug} fitId={fitId} a={a} b={b} />
    </>
  );
}
