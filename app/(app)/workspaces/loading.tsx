import { PageSkeleton } from "@/components/shell/page-skeleton";

export default function WorkspacesLoading() {
  return <PageSkeleton label="Loading your workspaces…" />;
}
