import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { auth } from "@/lib/auth/server";

/** The signed-in user as pages see them. */
export type CurrentUser = { id: string; name: string; email: string };

/** The user of the current request's session cookie, or null when signed out. */
export async function getCurrentUser(): Promise<CurrentUser | null> {
  const session = await auth.api.getSession({ headers: await headers() });
  if (!session) return null;
  const { id, name, email } = session.user;
  return { id, name, email };
}

/** Like getCurrentUser, but sends a signed-out visitor to /sign-in, returning to `nextPath` afterwards. */
export async function requireUser(nextPath?: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (user) return user;
  redirect(nextPath ? `/sign-in?next=${encodeURIComponent(nextPath)}` : "/sign-in");
}
