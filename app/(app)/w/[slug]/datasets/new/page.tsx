import type { Metadata } from "next";
import { UploadForm } from "@/components/datasets/upload-form";
import { PageHeader, Panel } from "@/components/ui";
import { describeByteLimit } from "@/lib/datasets";
import { env } from "@/lib/env";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Upload a dataset" };

export default async function NewDatasetPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { workspace } = await requireWorkspaceMember(slug, "editor");
  return (
    <>
      <PageHeader
        title="Upload a dataset"
        description={`Drop a band file, say what its columns are, and upload. The server reads the whole file again and refuses it, storing nothing, if any row is bad. At most ${env.DATASET_MAX_POINTS.toLocaleString("en-US")} points.`}
      />
      <Panel>
        <UploadForm slug={workspace.slug} maxBytes={env.DATASET_MAX_BYTES} maxBytesLabel={describeByteLimit(env.DATASET_MAX_BYTES)} />
      </Panel>
    </>
  );
}
