import { PageSkeleton } from "@/components/shell/page-skeleton";

export default function AppLoading() {
  return <PageSkeleton label="Loading…" />;
}
