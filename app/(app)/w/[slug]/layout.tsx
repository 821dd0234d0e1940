import type { ReactNode } from "react";
import { WorkspaceNav } from "@/components/shell/workspace-nav";
import { RoleBadge } from "@/components/ui";
import { getCurrentUser } from "@/lib/server/session";
import { requireWorkspaceMember } from "@/lib/server/workspace-access";

export const dynamic = "force-dynamic";

/**
 * Workspace header and section tabs. Pages below check access again for their own minimum role. A
 * signed-out visitor is left to the page, whose guard knows its own path to come back to after sign-in.
 * No loading.tsx sits in this tree on purpose: it would start streaming before the page's guard, and the
 * guard's 307 / 403 / 404 would then arrive as 200.
 */
export default async function WorkspaceLayout({ children, params }: { children: ReactNode; params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  if (!(await getCurrentUser())) return children;
  const { workspace, role } = await requireWorkspaceMember(slug, "viewer");
  return (
    <>
      <div className="border-b border-line bg-surface">
        <div className="mx-auto max-w-page px-4 pt-4">
          <div className="flex items-center gap-2">
            <p className="truncate text-base font-semibold text-ink">{workspace.name}</p>
            <RoleBadge role={role} />
          </div>
          <div className="mt-2">
            <WorkspaceNav slug={workspace.slug} />
          </div>
        </div>
      </div>
      <main className="mx-auto max-w-page px-4 py-8">{children}</main>
    </>
  );
}
