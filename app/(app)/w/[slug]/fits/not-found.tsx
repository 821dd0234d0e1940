import { EmptyState } from "@/components/ui";

export default function FitNotFound() {
  return <EmptyState title="No such fit" description="It may have been deleted, or the address is mistyped. Go back to the fits list." />;
}
