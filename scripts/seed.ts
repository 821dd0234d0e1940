import { closeDatabase } from "@/db/client";
import { getUserByEmail } from "@/db/queries/users";
import { getMembership, getWorkspaceBySlug } from "@/db/queries/workspaces";
import { auth } from "@/lib/auth/server";
import { seedDemoDatasets } from "@/lib/server/datasets/demo-datasets";
import { demoPassword, demoUsers, demoWorkspace } from "./lib/demo";

// Seeds the demo workspace and one user per role. Safe to run again: existing rows are left alone.

async function ensureUser(name: string, email: string): Promise<string> {
  const existing = await getUserByEmail(email);
  if (existing) return existing.id;
  const created = await auth.api.signUpEmail({ body: { name, email, password: demoPassword } });
  return created.user.id;
}

const userIds = new Map<string, string>();
for (const demo of demoUsers) userIds.set(demo.email, await ensureUser(demo.name, demo.email));

const owner = demoUsers.find((demo) => demo.role === "owner");
if (!owner) throw new Error("The demo needs an owner");

let workspace = await getWorkspaceBySlug(demoWorkspace.slug);
if (!workspace) {
  await auth.api.createOrganization({
    body: { name: demoWorkspace.name, slug: demoWorkspace.slug, userId: userIds.get(owner.email) },
  });
  workspace = await getWorkspaceBySlug(demoWorkspace.slug);
}
if (!workspace) throw new Error("The demo workspace could not be created");

for (const demo of demoUsers) {
  const userId = userIds.get(demo.email);
  if (!userId || (await getMembership({ workspaceId: workspace.id, userId }))) continue;
  await auth.api.addMember({ body: { userId, role: demo.role, organizationId: workspace.id } });
}

// The demo's datasets appear as uploaded by the editor, as they would be in a real lab.
const uploader = userIds.get((demoUsers.find((demo) => demo.role === "editor") ?? owner).email);
if (!uploader) throw new Error("The demo uploader was not created");
await seedDemoDatasets({ workspaceId: workspace.id, uploadedBy: uploader });

await closeDatabase();
console.log(`[bandwright] demo workspace "${demoWorkspace.name}" ready`);
