import { ButtonLink, EmptyState } from "@/components/ui";

/** Unknown workspace or no membership: the same answer, so a workspace's existence is not revealed. */
export default function WorkspaceNotFound() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <EmptyState
        title="Workspace not found"
        description="There is no workspace at this address that you belong to. Check the link, or ask its owner to invite you."
        action={<ButtonLink href="/workspaces">Your workspaces</ButtonLink>}
      />
    </main>
  );
}
