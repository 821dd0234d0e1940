import { createAccessControl } from "better-auth/plugins/access";

/** Workspace roles, from least to most privileged is viewer < editor < owner. */
export const workspaceRoles = ["owner", "editor", "viewer"] as const;
export type WorkspaceRole = (typeof workspaceRoles)[number];

const rank: Record<WorkspaceRole, number> = { viewer: 0, editor: 1, owner: 2 };

/** True when `actual` is at least as privileged as `minimum`. */
export function hasRole(actual: WorkspaceRole, minimum: WorkspaceRole): boolean {
  return rank[actual] >= rank[minimum];
}

/** The less privileged of two roles: what an API key may do is the lower of its own role and its user's. */
export function lowerRole(a: WorkspaceRole, b: WorkspaceRole): WorkspaceRole {
  return rank[a] <= rank[b] ? a : b;
}

/** Narrows a stored role string (better-auth keeps it as text) to one of ours. */
export function isWorkspaceRole(value: string): value is WorkspaceRole {
  return (workspaceRoles as readonly string[]).includes(value);
}

/**
 * Statements checked by better-auth's organization plugin (organization, member, invitation) plus our
 * own resources. Written out in full rather than built on the plugin's stock admin role, whose
 * statements include organization update/delete.
 */
const statements = {
  organization: ["update", "delete"],
  member: ["create", "update", "delete"],
  invitation: ["create", "cancel"],
  dataset: ["read", "create", "delete"],
  model: ["read", "create", "delete"],
  fit: ["read", "create", "cancel", "delete"],
} as const;

export const ac = createAccessControl(statements);

export const roles = {
  owner: ac.newRole({
    organization: ["update", "delete"],
    member: ["create", "update", "delete"],
    invitation: ["create", "cancel"],
    dataset: ["read", "create", "delete"],
    model: ["read", "create", "delete"],
    fit: ["read", "create", "cancel", "delete"],
  }),
  editor: ac.newRole({
    dataset: ["read", "create"],
    model: ["read", "create"],
    fit: ["read", "create", "cancel"],
  }),
  viewer: ac.newRole({
    dataset: ["read"],
    model: ["read"],
    fit: ["read"],
  }),
} satisfies Record<WorkspaceRole, unknown>;
