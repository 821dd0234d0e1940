import { organizationClient } from "better-auth/client/plugins";
import { createAuthClient } from "better-auth/react";
import { ac, roles } from "./roles";

/** Browser-side better-auth client; talks to /api/auth/* on the page's own origin. */
export const authClient = createAuthClient({
  plugins: [organizationClient({ ac, roles })],
});
