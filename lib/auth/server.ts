import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { APIError } from "better-auth/api";
import { organization } from "better-auth/plugins";
import { db, schema } from "@/db/client";
import { invitationMessage, passwordResetMessage } from "@/lib/email/messages";
import { sendMail } from "@/lib/email/send";
import { env } from "@/lib/env";
import { workspaceSlugSchema } from "@/lib/schemas/workspaces";
import { ac, isWorkspaceRole, roles } from "./roles";

/** Minimum password length for sign-up and reset (common practice for passphrases). */
export const passwordMinLength = 10;

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

// better-auth's own organization endpoints stay reachable under /api/auth and also accept its stock role
// names ("admin", "member") and comma-separated role lists; these guards keep every stored role one of ours.
function requireOwnRole(role: string): void {
  if (!isWorkspaceRole(role)) throw new APIError("BAD_REQUEST", { message: `Unknown role: ${role}` });
}

const authRateLimit = { window: env.AUTH_RATE_LIMIT_WINDOW_SECONDS, max: env.AUTH_RATE_LIMIT_MAX };

export const auth = betterAuth({
  appName: "Bandwright",
  baseURL: env.APP_URL,
  secret: env.BETTER_AUTH_SECRET,
  trustedOrigins: [new URL(env.APP_URL).origin],
  database: drizzleAdapter(db, { provider: "pg", schema }),
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
  // counts, so repeated failed attempts from one address are refused with 429 until the window passes.
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
      invitationExpiresIn: 7 * 24 * 60 * 60,
      organizationHooks: {
        beforeCreateOrganization: async ({ organization: workspace }) => {
          if (!workspaceSlugSchema.safeParse(workspace.slug).success) {
            throw new APIError("BAD_REQUEST", { message: "Not a valid workspace address." });
          }
        },
        beforeCreateInvitation: async ({ invitation }) => requireOwnRole(invitation.role),
        beforeAddMember: async ({ member }) => requireOwnRole(member.role),
        beforeUpdateMemberRole: async ({ newRole }) => requireOwnRole(newRole),
      },
      sendInvitationEmail: async ({ id, email, role, organization: workspace, inviter }) => {
        await sendMail(
          invitationMessage({
            to: email,
            workspaceName: workspace.name,
            inviterName: inviter.user.name,
            role,
            acceptUrl: invitationUrl(id),
          }),
        );
      },
    }),
    nextCookies(),
  ],
});
