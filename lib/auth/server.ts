import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { APIError } from "better-auth/api";
import { organization } from "better-auth/plugins";
import { db, schema } from "@/db/client";
import { passwordResetMessage } from "@/lib/email/messages";
import { sendMail } from "@/lib/email/send";
import { env } from "@/lib/env";
import { workspaceNameSchema, workspaceSlugSchema } from "@/lib/schemas/workspaces";
import { ac, isWorkspaceRole, roles } from "./roles";
import { userNameMaxLength, userNameSchema } from "./user-name";

/** Minimum password length for sign-up and reset (common practice for passphrases). */
export const passwordMinLength = 10;

/** How long an invitation link stays valid, seconds (7 days). */
export const invitationLifetimeSeconds = 7 * 24 * 60 * 60;

/** Where the invitation e-mail sends the invitee; the page there offers "accept". */
export function invitationUrl(invitationId: string): string {
  return new URL(`/invitations/${encodeURIComponent(invitationId)}`, env.APP_URL).toString();
}

/** Where the reset e-mail sends the user; the page there reads `token` and calls resetPassword. */
export function passwordResetUrl(token: string): string {
  const url = new URL("/reset-password", env.APP_URL);
  url.searchParams.set("token", token);
  return url.toString();
}

// Server-side calls (auth.api.*) may still reach the plugin with its stock role names ("admin", "member")
// or comma-separated role lists; these guards keep every stored role one of ours.
function requireOwnRole(role: string): void {
  if (!isWorkspaceRole(role)) throw new APIError("BAD_REQUEST", { message: `Unknown role: ${role}` });
}

function requireValid(schema: { safeParse: (value: unknown) => { success: boolean } }, value: unknown, message: string): void {
  if (!schema.safeParse(value).success) throw new APIError("BAD_REQUEST", { message });
}

// Workspaces are managed through our own routes and actions (one authorisation rule, our input schemas,
// 404 for non-members). The plugin's HTTP endpoints would bypass all three, and some tell an outsider
// whether a workspace exists, so every one of them is switched off except accepting an invitation, which
// checks the invitee's own session. Server-side auth.api.* calls are not affected.
const nameMessage = `Name must be 1 to ${userNameMaxLength} characters.`;

const disabledOrganizationPaths = [
  "add-team-member", "cancel-invitation", "check-slug", "create", "create-role", "create-team", "delete",
  "delete-role", "get-active-member", "get-active-member-role", "get-full-organization", "get-invitation",
  "get-organization", "get-role", "invite-member", "leave", "list", "list-invitations", "list-members",
  "list-roles", "list-team-members", "list-teams", "list-user-invitations", "list-user-teams",
  "reject-invitation", "remove-member", "remove-team", "remove-team-member", "set-active", "set-active-team",
  "update", "update-member-role", "update-role", "update-team",
].map((name) => `/organization/${name}`);

const authRateLimit = { window: env.AUTH_RATE_LIMIT_WINDOW_SECONDS, max: env.AUTH_RATE_LIMIT_MAX };

export const auth = betterAuth({
  appName: "Bandwright",
  baseURL: env.APP_URL,
  secret: env.BETTER_AUTH_SECRET,
  trustedOrigins: [new URL(env.APP_URL).origin],
  database: drizzleAdapter(db, { provider: "pg", schema }),
  disabledPaths: disabledOrganizationPaths,
  // The client address comes from X-Forwarded-For, which scripts/serve-app.ts rewrites to the one address
  // it believes (TRUSTED_PROXIES); a single value is all better-auth ever sees.
  advanced: { ipAddress: { ipAddressHeaders: ["x-forwarded-for"] } },
  databaseHooks: {
    user: {
      create: { before: async (user) => requireValid(userNameSchema, user.name, nameMessage) },
      update: {
        before: async (user) => {
          if (user.name !== undefined) requireValid(userNameSchema, user.name, nameMessage);
        },
      },
    },
  },
  emailAndPassword: {
    enabled: true,
    minPasswordLength: passwordMinLength,
    autoSignIn: true,
    revokeSessionsOnPasswordReset: true,
    resetPasswordTokenExpiresIn: 60 * 60,
    sendResetPassword: async ({ user, token }) => {
      await sendMail(passwordResetMessage({ to: user.email, name: user.name, resetUrl: passwordResetUrl(token) }));
    },
  },
  // Counters live in PostgreSQL so every app process shares them. Every request to sign-in or sign-up
  // counts, so repeated failed attempts from one address are refused with 429 until the window passes;
  // lib/server/auth-handler.ts adds the per-account limit on failed sign-ins.
  rateLimit: {
    enabled: true,
    storage: "database",
    customRules: { "/sign-in/*": authRateLimit, "/sign-up/*": authRateLimit },
  },
  plugins: [
    organization({
      ac,
      roles,
      creatorRole: "owner",
      invitationExpiresIn: invitationLifetimeSeconds,
      organizationHooks: {
        beforeCreateOrganization: async ({ organization: workspace }) => {
          requireValid(workspaceSlugSchema, workspace.slug, "Not a valid workspace address.");
          requireValid(workspaceNameSchema, workspace.name, "Not a valid workspace name.");
        },
        beforeUpdateOrganization: async ({ organization: changes }) => {
          if (changes.slug !== undefined) requireValid(workspaceSlugSchema, changes.slug, "Not a valid workspace address.");
          if (changes.name !== undefined) requireValid(workspaceNameSchema, changes.name, "Not a valid workspace name.");
        },
        beforeCreateInvitation: async ({ invitation }) => requireOwnRole(invitation.role),
        beforeAddMember: async ({ member }) => requireOwnRole(member.role),
        beforeUpdateMemberRole: async ({ newRole }) => requireOwnRole(newRole),
      },
    }),
    nextCookies(),
  ],
});
