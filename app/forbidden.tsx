import { ButtonLink, EmptyState } from "@/components/ui";

/** 403 outside a workspace's own pages. */
export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-4 py-16">
      <EmptyState
        title="Not allowed"
        description="Your account does not have the role this page needs. Ask a workspace owner."
        action={<ButtonLink href="/workspaces">Your workspaces</ButtonLink>}
      />
    </main>
  );
}
