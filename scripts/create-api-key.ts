import { z } from "zod";
import { closeDatabase } from "@/db/client";
import { getUserByEmail } from "@/db/queries/users";
import { getMembership, getWorkspaceBySlug } from "@/db/queries/workspaces";
import { issueApiKey } from "@/lib/server/api-keys";

// npm run api-key -- <member e-mail> <workspace slug> [label]
// Prints a new key once; only its SHA-256 is stored. The key acts as that member, in that workspace only.
const args = z.tuple([z.email(), z.string().min(1)]).rest(z.string()).safeParse(process.argv.slice(2));
if (!args.success) {
  console.error("usage: npm run api-key -- <member e-mail> <workspace slug> [label]");
  process.exit(2);
}
const [email, slug, label = "script"] = args.data;

const user = await getUserByEmail(email);
const workspace = await getWorkspaceBySlug(slug);
if (!user || !workspace || !(await getMembership({ workspaceId: workspace.id, userId: user.id }))) {
  console.error(`${email} is not a member of a workspace "${slug}".`);
  process.exit(1);
}
const key = await issueApiKey({ userId: user.id, workspaceId: workspace.id, label });
await closeDatabase();
console.log(key);
