import type { ReactNode } from "react";
import { QueryProvider } from "@/components/providers/query-provider";

/** The fit pages read their data in the browser through TanStack Query. */
export default function FitsLayout({ children }: { children: ReactNode }) {
  return <QueryProvider>{children}</QueryProvider>;
}
