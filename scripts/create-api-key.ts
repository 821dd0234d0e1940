import { z } from "zod";
import { closeDatabase } from "@/db/client";
import { getUserByEmail } from "@/db/queries/users";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { workspaceRoles } from "@/lib/auth/roles";
import { createApiKey } from "@/lib/server/api-keys";
import { AppError } from "@/lib/server/errors";

// npm run api-key -- <member e-mail> <workspace slug> [label] [owner|editor|viewer]
// Prints a new key once; only its SHA-256 is stored. The key acts as that member, in that workspace only,
// with the lower of its role (default: the member's role now) and the member's role at each request.
const usage = `usage: npm run api-key -- <member e-mail> <workspace slug> [label] [${workspaceRoles.join("|")}]`;
const args = z
  .tuple([z.email(), z.string().min(1)])
  .rest(z.string())
  .refine((rest) => rest.length <= 4)
  .safeParse(process.argv.slice(2));
const role = z.enum(workspaceRoles).optional().safeParse(args.data?.[3]);
if (!args.success || !role.success) {
  console.error(usage);
  process.exit(2);
}
const [email, slug, label = "script"] = args.data;

const user = await getUserByEmail(email);
const workspace = await getWorkspaceBySlug(slug);
try {
  if (!user || !workspace) throw new AppError("not_found");
  const created = await createApiKey({ userId: user.id, workspaceId: workspace.id, label, role: role.data });
  console.log(created.key);
} catch (error) {
  if (!(error instanceof AppError)) throw error;
  console.error(error.code === "not_found" ? `${email} is not a member of a workspace "${slug}".` : error.message);
  process.exitCode = 1;
} finally {
  await closeDatabase();
}
