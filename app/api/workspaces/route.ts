import { NextResponse } from "next/server";
import { listWorkspacesForUser } from "@/db/queries/workspaces";
import { lowerRole } from "@/lib/auth/roles";
import { AppError } from "@/lib/server/errors";
import { userRoute } from "@/lib/server/route";
import { createWorkspace } from "@/lib/server/workspaces";
import { createWorkspaceInput } from "@/lib/schemas/workspaces";

/**
 * The caller's workspaces: `{ workspaces: [{ slug, name, role, createdAt }] }`. An API key sees only its
 * own, with the role it acts with there (the lower of its own and its user's).
 */
export const GET = userRoute({}, async ({ principal }) => {
  const all = await listWorkspacesForUser(principal.user.id);
  if (principal.via === "api-key") {
    const own = all.filter((w) => w.id === principal.onlyWorkspaceId);
    return { workspaces: own.map(({ slug, name, role, createdAt }) => ({ slug, name, role: lowerRole(role, principal.keyRole), createdAt })) };
  }
  return { workspaces: all.map(({ slug, name, role, createdAt }) => ({ slug, name, role, createdAt })) };
});

/** Creates a workspace owned by the caller: `{ "name" }` → 201 `{ "slug", "name", "role" }`. */
export const POST = userRoute({ input: createWorkspaceInput }, async ({ principal, input }) => {
  if (principal.via === "api-key") throw new AppError("forbidden", "An API key works inside its own workspace only.");
  const workspace = await createWorkspace({ userId: principal.user.id, name: input.name });
  return NextResponse.json({ slug: workspace.slug, name: workspace.name, role: "owner" }, { status: 201 });
});
