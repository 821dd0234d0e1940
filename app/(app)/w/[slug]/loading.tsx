import { PageSkeleton } from "@/components/shell/page-skeleton";

export default function WorkspaceLoading() {
  return <PageSkeleton label="Loading the workspace…" />;
}
