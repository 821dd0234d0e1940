import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CompareView } from "@/components/fits/compare-view";
import { PageHeader } from "@/components/ui";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Compare revisions" };

export default async function ComparePage({ params, searchParams }: { params: Promise<{ slug: string; fitId: string }>; searchParams: Promise<{ a?: string; b?: string }> }) {
  const { slug, fitId } = await params;
  const query = await searchParams;
  const a = Number(query.a);
  const b = Number(query.b);
  const { workspace } = await requireWorkspaceMember(slug, "viewer");
  if (![a, b].every((n) => Number.isInteger(n) && n >= 1)) notFound();
  return (
    <>
      <PageHeader title={`Revision ${a} and revision ${b}`} description="A is the first revision, B the second." />
      <CompareView slug={workspace.slug} fitId={fitId} a={a} b={b} />
    </>
  );
}
