import type { ReactNode } from "react";
import { AppHeader } from "@/components/shell/app-header";
import { SkipLink } from "@/components/shell/skip-link";
import { getCurrentUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";

/** Shell of the app: header with the signed-in user. Each page checks access itself. */
export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await getCurrentUser();
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <AppHeader user={user} />
      <div id="content" tabIndex={-1} className="flex-1 outline-none">
        {children}
      </div>
    </div>
  );
}
