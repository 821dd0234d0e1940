import { getUserById } from "@/db/queries/users";
import type { WorkspaceRole } from "@/lib/auth/roles";
import { auth } from "@/lib/auth/server";
import { AppError } from "./errors";
import { verifyApiKey } from "./api-keys";
import type { CurrentUser } from "./session";

/**
 * Who is making a request: a browser session, or a script holding an API key. A key is bound to one
 * workspace (`onlyWorkspaceId`); it reaches nothing else, and there it acts at most as `keyRole`.
 */
export type Principal =
  | { user: CurrentUser; via: "session" }
  | { user: CurrentUser; via: "api-key"; onlyWorkspaceId: string; keyRole: WorkspaceRole };

const bearerPattern = /^Bearer\s+(\S+)$/i;

/** Resolves the principal from request headers; null when neither a session nor a key is present. */
export async function resolvePrincipal(headers: Headers): Promise<Principal | null> {
  const authorization = headers.get("authorization");
  if (authorization) {
    const match = bearerPattern.exec(authorization);
    const found = match ? await verifyApiKey(match[1]) : null;
    // A presented but unknown key is an error, not a fall-back to the cookie: scripts should learn early.
    if (!found) throw new AppError("unauthenticated", "The API key is not valid.");
    const user = await getUserById(found.userId);
    if (!user) throw new AppError("unauthenticated", "The API key is not valid.");
    return { user, via: "api-key", onlyWorkspaceId: found.workspaceId, keyRole: found.role };
  }
  const session = await auth.api.getSession({ headers });
  if (!session) return null;
  const { id, name, email } = session.user;
  return { user: { id, name, email }, via: "session" };
}
