import { z } from "zod";
import { workspaceRoles } from "@/lib/auth/roles";

/** Longest workspace name we store; longer names are refused, not truncated. */
export const workspaceNameMaxLength = 80;

export const workspaceNameSchema = z
  .string({ error: "Name is required." })
  .trim()
  .min(1, { error: "Name is required." })
  .max(workspaceNameMaxLength, { error: `Name must be at most ${workspaceNameMaxLength} characters.` });

export const workspaceSlugSchema = z
  .string({ error: "Workspace is required." })
  .regex(/^[a-z0-9](?:[a-z0-9-]{0,94}[a-z0-9])?$/, { error: "Not a workspace address." });

export const workspaceRoleSchema = z.enum(workspaceRoles, {
  error: `Role must be one of: ${workspaceRoles.join(", ")}.`,
});

const emailSchema = z
  .string({ error: "E-mail is required." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid e-mail address." }).max(254, { error: "E-mail is too long." }));

/** Body of POST /api/workspaces and the create form. */
export const createWorkspaceInput = z.object({ name: workspaceNameSchema });
export type CreateWorkspaceInput = z.infer<typeof createWorkspaceInput>;

/** Body of POST /api/workspaces/{slug}/invitations and the invite form. */
export const inviteMemberInput = z.object({ email: emailSchema, role: workspaceRoleSchema });
export type InviteMemberInput = z.infer<typeof inviteMemberInput>;

export const changeMemberRoleInput = z.object({
  memberId: z.string({ error: "Member is required." }).min(1, { error: "Member is required." }),
  role: workspaceRoleSchema,
});
export type ChangeMemberRoleInput = z.infer<typeof changeMemberRoleInput>;

export const removeMemberInput = z.object({
  memberId: z.string({ error: "Member is required." }).min(1, { error: "Member is required." }),
});
export type RemoveMemberInput = z.infer<typeof removeMemberInput>;

/** Withdrawing a pending invitation (owners; the members page and DELETE …/invitations/{id}). */
export const cancelInvitationInput = z.object({
  invitationId: z.string({ error: "Invitation is required." }).min(1, { error: "Invitation is required." }),
});
export type CancelInvitationInput = z.infer<typeof cancelInvitationInput>;

export const acceptInvitationInput = z.object({
  invitationId: z.string({ error: "Invitation is required." }).min(1, { error: "Invitation is required." }),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInput>;
