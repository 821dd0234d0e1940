import type { Metadata } from "next";
import { FitsList } from "@/components/fits/fits-list";
import { ButtonLink, PageHeader } from "@/components/ui";
import { hasRole } from "@/lib/auth/roles";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Fits" };

export default async function FitsPage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ dataset?: string }> }) {
  const { slug } = await params;
  const { dataset } = await searchParams;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  const canLaunch = hasRole(role, "editor");
  return (
    <>
      <PageHeader
        title="Fits"
        description="Each fit is a model fitted to one dataset; every launch is a revision you can inspect and compare."
        actions={canLaunch ? <ButtonLink href={`/w/${workspace.slug}/fits/new${dataset ? `?dataset=${encodeURIComponent(dataset)}` : ""}`}>New fit</ButtonLink> : undefined}
      />
      <FitsList slug={workspace.slug} datasetId={dataset} canLaunch={canLaunch} />
    </>
  );
}
