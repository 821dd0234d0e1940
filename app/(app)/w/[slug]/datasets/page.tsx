import type { Metadata } from "next";
import { DatasetsTable } from "@/components/datasets/datasets-table";
import { ButtonLink, EmptyState, PageHeader, Panel } from "@/components/ui";
import { listDatasets } from "@/db/queries/datasets";
import { hasRole } from "@/lib/auth/roles";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Datasets" };

export default async function DatasetsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  const canUpload = hasRole(role, "editor");
  const datasets = await listDatasets(workspace.id);
  const upload = canUpload ? <ButtonLink href={`/w/${workspace.slug}/datasets/new`}>Upload a band file</ButtonLink> : undefined;

  return (
    <>
      <PageHeader
        title="Datasets"
        description="Band files from DFT post-processing or photoemission peak fits, kept byte for byte and parsed into points."
        actions={datasets.length > 0 ? upload : undefined}
      />
      {datasets.length === 0 ? (
        <EmptyState
          title="No datasets yet"
          description={
            canUpload
              ? "Upload a CSV or TSV band file: map its columns, choose units, and the points are ready to fit."
              : "An editor or owner of this workspace uploads band files; ask one of them to add the first."
          }
          action={upload}
        />
      ) : (
        <Panel flush>
          <DatasetsTable rows={datasets.map((d) => ({ ...d, href: `/w/${workspace.slug}/datasets/${d.id}` }))} />
        </Panel>
      )}
    </>
  );
}
