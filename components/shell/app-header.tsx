import Link from "next/link";
import type { CurrentUser } from "@/lib/server/session";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { Brand } from "./brand";

/** Top bar of the signed-in app: brand, the user's workspaces, who is signed in. */
export function AppHeader({ user }: { user: CurrentUser | null }) {
  return (
    <header className="border-b border-line bg-surface">
      <div className="mx-auto flex h-12 max-w-page items-center justify-between gap-4 px-4">
        <div className="flex items-center gap-6">
          <Brand href={user ? "/workspaces" : "/"} />
          {user ? (
            <Link href="/workspaces" className="text-sm text-ink-muted">
              Workspaces
            </Link>
          ) : null}
        </div>
        {user ? (
          <div className="flex items-center gap-3 text-sm">
            <span className="text-ink-muted" title={user.email}>
              {user.name}
            </span>
            <SignOutButton />
          </div>
        ) : (
          <Link href="/sign-in" className="text-sm">
            Sign in
          </Link>
        )}
      </div>
    </header>
  );
}
