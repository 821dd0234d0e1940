import { ButtonLink, EmptyState } from "@/components/ui";
import { WorkspaceHomeLink } from "@/components/shell/workspace-home-link";

/** A member below the page's role (403): what the page needs and who can change it. */
export default function WorkspaceForbidden() {
  return (
    <div className="mx-auto max-w-xl py-8">
      <EmptyState
        title="Your role does not allow this page"
        description="Uploading datasets, launching fits and new revisions need the editor or owner role; managing members needs the owner role. Ask a workspace owner to change your role."
        action={
          <div className="flex gap-2">
            <WorkspaceHomeLink />
            <ButtonLink href="/workspaces" variant="secondary">
              Your workspaces
            </ButtonLink>
          </div>
        }
      />
    </div>
  );
}
