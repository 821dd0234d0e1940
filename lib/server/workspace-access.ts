import "server-only";
import { headers } from "next/headers";
import { forbidden, notFound } from "next/navigation";
import { getMembership, getWorkspaceBySlug, type WorkspaceSummary } from "@/db/queries/workspaces";
import { hasRole, lowerRole, type WorkspaceRole } from "@/lib/auth/roles";
import { workspaceSlugSchema } from "@/lib/schemas/workspaces";
import { AppError } from "./errors";
import { resolvePrincipal, type Principal } from "./principal";
import { requireUser, type CurrentUser } from "./session";

/** What an authorised request knows about its workspace. */
export type WorkspaceAccess = { user: CurrentUser; workspace: WorkspaceSummary; role: WorkspaceRole; memberId: string };

/**
 * The one authorisation rule. Non-members (and keys bound to another workspace) get not_found, so a
 * workspace's existence is never revealed; members below `minimumRole` get forbidden. An API key acts
 * with the lower of its own role and its user's current role.
 */
export async function authorizeWorkspace(
  principal: Principal,
  slug: string,
  minimumRole: WorkspaceRole,
): Promise<WorkspaceAccess> {
  if (!workspaceSlugSchema.safeParse(slug).success) throw new AppError("not_found");
  const workspace = await getWorkspaceBySlug(slug);
  if (!workspace) throw new AppError("not_found");
  if (principal.via === "api-key" && principal.onlyWorkspaceId !== workspace.id) throw new AppError("not_found");
  const membership = await getMembership({ workspaceId: workspace.id, userId: principal.user.id });
  if (!membership) throw new AppError("not_found");
  const role = principal.via === "api-key" ? lowerRole(principal.keyRole, membership.role) : membership.role;
  if (!hasRole(role, minimumRole)) throw new AppError("forbidden");
  return { user: principal.user, workspace, role, memberId: membership.memberId };
}

/**
 * For pages: sends a signed-out visitor to sign-in (and back to `returnTo` afterwards, by default the
 * workspace home; pass the page's own path), calls notFound() for a non-member (404) and forbidden() for a
 * member below `minimumRole` (403, app/(app)/w/[slug]/forbidden.tsx). The statuses are real only when no
 * loading.tsx sits above the page (it would start streaming first).
 */
export async function requireWorkspaceMember(
  slug: string,
  minimumRole: WorkspaceRole = "viewer",
  returnTo = `/w/${encodeURIComponent(slug)}`,
): Promise<WorkspaceAccess> {
  const user = await requireUser(returnTo);
  try {
    return await authorizeWorkspace({ user, via: "session" }, slug, minimumRole);
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    if (error instanceof AppError && error.code === "forbidden") forbidden();
    throw error;
  }
}

/** For handlers and actions: the principal of the current request or AppError("unauthenticated"). */
export async function requirePrincipal(requestHeaders?: Headers): Promise<Principal> {
  const principal = await resolvePrincipal(requestHeaders ?? (await headers()));
  if (!principal) throw new AppError("unauthenticated");
  return principal;
}
