import { createAuthClient } from "better-auth/react";

/**
 * Browser-side better-auth client for sign-up, sign-in, sign-out and password reset; talks to
 * /api/auth/* on the page's own origin. Workspaces go through our own actions, not the plugin's client.
 */
export const authClient = createAuthClient();
