import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import type { User } from "@/db/schema";
import { auth } from "@/lib/auth/server";

/** The signed-in user as pages see them. */
export type CurrentUser = Pick<User, "id" | "name" | "email">;

/** The user of the current request's session cookie, or null when signed out (looked up once per request). */
export const getCurrentUser = cache(async (): Promise<CurrentUser | null> => {
  const session = await auth.api.getSession({ headers: await headers() });
  if (!session) return null;
  const { id, name, email } = session.user;
  return { id, name, email };
});

/** Like getCurrentUser, but sends a signed-out visitor to /sign-in, returning to `nextPath` afterwards. */
export async function requireUser(nextPath?: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (user) return user;
  redirect(nextPath ? `/sign-in?next=${encodeURIComponent(nextPath)}` : "/sign-in");
}
