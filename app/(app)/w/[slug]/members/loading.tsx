import { PageSkeleton } from "@/components/shell/page-skeleton";

export default function MembersLoading() {
  return <PageSkeleton label="Loading members…" />;
}
