import { describe, expect, it } from "vitest";
import { getUserByEmail } from "@/db/queries/users";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { issueApiKey } from "@/lib/server/api-keys";
import { TestClient } from "@/tests/support/client";

describe("GET /api/health", () => {
  it("reports the database and a live worker", async () => {
    const response = await new TestClient().get("/api/health");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ ok: true, database: "ok", worker: "ok" });
  });
});

describe("API keys", () => {
  it("act as their user inside their own workspace only", async () => {
    const owner = new TestClient();
    const email = await owner.newUser("scripter");
    const mine = ((await owner.post("/api/workspaces", { name: "Scripted Lab" })).body as { slug: string }).slug;
    const other = ((await owner.post("/api/workspaces", { name: "Other Lab" })).body as { slug: string }).slug;
    const user = await getUserByEmail(email);
    const workspace = await getWorkspaceBySlug(mine);
    const key = await issueApiKey({ userId: user?.id ?? "", workspaceId: workspace?.id ?? "", label: "test" });

    const script = TestClient.withApiKey(key);
    expect((await script.get(`/api/workspaces/${mine}`)).body).toMatchObject({ slug: mine, role: "owner" });
    expect((await script.get(`/api/workspaces/${other}`)).status).toBe(404);
    const listed = (await script.get("/api/workspaces")).body as { workspaces: Array<{ slug: string }> };
    expect(listed.workspaces.map((w) => w.slug)).toEqual([mine]);
    expect((await script.post("/api/workspaces", { name: "By key" })).status).toBe(403);

    const forged = await TestClient.withApiKey(`${key.slice(0, -2)}xx`).get(`/api/workspaces/${mine}`);
    expect(forged.status).toBe(401);
    expect(forged.body).toMatchObject({ error: { code: "unauthenticated" } });
  });
});
