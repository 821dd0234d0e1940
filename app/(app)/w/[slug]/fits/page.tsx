import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FitsList } from "@/components/fits/fits-list";
import { ButtonLink, PageHeader } from "@/components/ui";
import { getDataset } from "@/db/queries/datasets";
import { hasRole } from "@/lib/auth/roles";
import { isDatasetId } from "@/lib/server/datasets/dataset-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Fits" };

export default async function FitsPage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ dataset?: string }> }) {
  const { slug } = await params;
  const { dataset: datasetId } = await searchParams;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  // One dataset's fits: an unknown id (or another workspace's) is a 404, as on the dataset page.
  const dataset = datasetId === undefined ? null : isDatasetId(datasetId) ? await getDataset({ workspaceId: workspace.id, id: datasetId }) : null;
  if (datasetId !== undefined && !dataset) notFound();
  const canLaunch = hasRole(role, "editor");
  return (
    <>
      <PageHeader
        eyebrow={dataset ? "Fits of a dataset" : undefined}
        title={dataset ? `Fits of ${dataset.name}` : "Fits"}
        description={
          dataset ? (
            <>
              Every fit of this dataset, newest first. <Link className="text-accent-700 hover:underline" href={`/w/${workspace.slug}/datasets/${dataset.id}`}>Back to the dataset</Link> ·{" "}
              <Link className="text-accent-700 hover:underline" href={`/w/${workspace.slug}/fits`}>All fits</Link>
            </>
          ) : (
            "Each fit is a model fitted to one dataset; every launch is a revision you can inspect and compare."
          )
        }
        actions={canLaunch ? <ButtonLink href={`/w/${workspace.slug}/fits/new${dataset ? `?dataset=${dataset.id}` : ""}`}>New fit</ButtonLink> : undefined}
      />
      <FitsList slug={workspace.slug} datasetId={dataset?.id} canLaunch={canLaunch} />
    </>
  );
}
