import type { Metadata } from "next";
import { ApiKeysTable } from "@/components/api-keys/api-keys-table";
import { CreateKeyForm } from "@/components/api-keys/create-key-form";
import { PageHeader, Panel } from "@/components/ui";
import { listVisibleApiKeys } from "@/lib/server/api-keys";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "API keys" };

export default async function ApiKeysPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const access = await requireWorkspaceMember(slug, "viewer", `/w/${encodeURIComponent(slug)}/settings/api-keys`);
  const keys = await listVisibleApiKeys(access);
  const isOwner = access.role === "owner";
  return (
    <>
      <PageHeader
        title="API keys"
        description="Keys let scripts and notebooks call Bandwright's API in this workspace as you: send Authorization: Bearer <key>. A key does at most what its role allows, and never more than you may do now."
      />
      <div className="flex flex-col gap-6">
        <Panel title="Create a key">
          <CreateKeyForm slug={access.workspace.slug} ownRole={access.role} />
        </Panel>
        <Panel
          title={isOwner ? "Keys of this workspace" : "Your keys"}
          description={
            isOwner
              ? "As an owner you see and may revoke every member's keys; members see and revoke their own."
              : "You see and may revoke your own keys; owners may revoke any key of the workspace."
          }
          flush
        >
          <ApiKeysTable slug={access.workspace.slug} keys={keys} />
        </Panel>
      </div>
    </>
  );
}
