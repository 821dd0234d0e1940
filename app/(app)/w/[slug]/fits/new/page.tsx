import type { Metadata } from "next";
import { LaunchForm } from "@/components/fits/launch-form";
import { PageHeader } from "@/components/ui";
import { getDataset } from "@/db/queries/datasets";
import { isDatasetId } from "@/lib/server/datasets/dataset-access";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "New fit" };

export default async function NewFitPage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ dataset?: string }> }) {
  const { slug } = await params;
  const { dataset: datasetId } = await searchParams;
  const { workspace } = await requireWorkspaceMember(slug, "editor");
  // `?dataset=<id>` (the dataset page's "New fit on this dataset") pre-selects a dataset of this workspace;
  // any other value leaves the choice open.
  const dataset = datasetId && isDatasetId(datasetId) ? await getDataset({ workspaceId: workspace.id, id: datasetId }) : null;
  return (
    <>
      <PageHeader
        title={dataset ? `New fit on ${dataset.name}` : "New fit"}
        description="Choose the data and a model, check the preview, then launch. The fit runs in the background; you can watch it."
      />
      <LaunchForm slug={workspace.slug} mode={{ kind: "new-fit", datasetId: dataset?.id }} />
    </>
  );
}
