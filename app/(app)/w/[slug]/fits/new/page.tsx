import type { Metadata } from "next";
import { LaunchForm } from "@/components/fits/launch-form";
import { PageHeader } from "@/components/ui";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "New fit" };

export default async function NewFitPage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ dataset?: string }> }) {
  const { slug } = await params;
  const { dataset } = await searchParams;
  const { workspace } = await requireWorkspaceMember(slug, "editor");
  return (
    <>
      <PageHeader title="New fit" description="Choose the data and a model, check the preview, then launch. The fit runs in the background; you can watch it." />
      <LaunchForm slug={workspace.slug} mode={{ kind: "new-fit", datasetId: dataset }} />
    </>
  );
}
