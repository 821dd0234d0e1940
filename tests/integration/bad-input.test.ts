import { beforeAll, describe, expect, it } from "vitest";
import { getWorkspaceBySlug, listPendingInvitations, listWorkspacesForUser } from "@/db/queries/workspaces";
import { getUserByEmail } from "@/db/queries/users";
import { TestClient, testEmail } from "@/tests/support/client";

// Bad input of issue 2: malformed JSON, missing fields, an over-long name, an invalid e-mail, an unknown
// role → 4xx with a clear message and nothing stored.

let owner: TestClient;
let ownerEmail: string;
let slug: string;

beforeAll(async () => {
  owner = new TestClient();
  ownerEmail = await owner.newUser("strict");
  slug = ((await owner.post("/api/workspaces", { name: "Strict Lab" })).body as { slug: string }).slug;
});

async function workspaceCount(): Promise<number> {
  const user = await getUserByEmail(ownerEmail);
  return (await listWorkspacesForUser(user?.id ?? "")).length;
}

async function pendingCount(): Promise<number> {
  const workspace = await getWorkspaceBySlug(slug);
  return (await listPendingInvitations(workspace?.id ?? "")).length;
}

describe("POST /api/workspaces refuses bad input", () => {
  const cases: Array<{ title: string; body: unknown; status: number; code: string; message: RegExp }> = [
    { title: "malformed JSON", body: '{"name": "Unclosed', status: 400, code: "invalid_json", message: /not valid JSON/ },
    { title: "an empty body", body: "", status: 400, code: "invalid_json", message: /empty/ },
    { title: "a missing name", body: {}, status: 422, code: "validation_failed", message: /Name is required/ },
    { title: "a blank name", body: { name: "   " }, status: 422, code: "validation_failed", message: /Name is required/ },
    { title: "an over-long name", body: { name: "x".repeat(81) }, status: 422, code: "validation_failed", message: /at most 80/ },
    { title: "a name of the wrong type", body: { name: 42 }, status: 422, code: "validation_failed", message: /Name/ },
  ];
  for (const testCase of cases) {
    it(`${testCase.title} → ${testCase.status}`, async () => {
      const before = await workspaceCount();
      const response = await owner.request("POST", "/api/workspaces", testCase.body);
      expect(response.status).toBe(testCase.status);
      const error = (response.body as { error: { code: string; message: string } }).error;
      expect(error.code).toBe(testCase.code);
      expect(error.message).toMatch(testCase.message);
      expect(await workspaceCount()).toBe(before);
    });
  }

  it("returns the field's messages under issues", async () => {
    const response = await owner.post("/api/workspaces", { name: "y".repeat(200) });
    expect(response.body).toMatchObject({ error: { issues: { name: [expect.stringMatching(/at most 80/)] } } });
  });
});

describe("POST /api/workspaces/{slug}/invitations refuses bad input", () => {
  const cases: Array<{ title: string; body: unknown; field: string; message: RegExp }> = [
    { title: "an invalid e-mail", body: { email: "not-an-address", role: "viewer" }, field: "email", message: /valid e-mail/ },
    { title: "a missing e-mail", body: { role: "viewer" }, field: "email", message: /E-mail is required/ },
    { title: "an unknown role", body: { email: testEmail("role"), role: "admin" }, field: "role", message: /owner, editor, viewer/ },
    { title: "a missing role", body: { email: testEmail("role") }, field: "role", message: /owner, editor, viewer/ },
  ];
  for (const testCase of cases) {
    it(`${testCase.title} → 422`, async () => {
      const before = await pendingCount();
      const response = await owner.post(`/api/workspaces/${slug}/invitations`, testCase.body);
      expect(response.status).toBe(422);
      const error = (response.body as { error: { code: string; issues: Record<string, string[]> } }).error;
      expect(error.code).toBe("validation_failed");
      expect(error.issues[testCase.field]?.[0]).toMatch(testCase.message);
      expect(await pendingCount()).toBe(before);
    });
  }

  it("malformed JSON → 400, nothing stored", async () => {
    const before = await pendingCount();
    const response = await owner.request("POST", `/api/workspaces/${slug}/invitations`, "{email:");
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ error: { code: "invalid_json" } });
    expect(await pendingCount()).toBe(before);
  });
});

describe("request bodies and origins", () => {
  const bigName = (kib: number) => JSON.stringify({ name: "z".repeat(kib * 1024) });

  it("refuses a 100 KiB body with 413 before reading it into a workspace", async () => {
    const before = await workspaceCount();
    const response = await owner.request("POST", "/api/workspaces", bigName(100));
    expect(response.status).toBe(413);
    expect(response.body).toMatchObject({ error: { code: "payload_too_large", message: expect.stringMatching(/larger than 64 KiB/) } });
    expect(await workspaceCount()).toBe(before);
  });

  it("refuses a 100 KiB body on better-auth's sign-up with 413, creating no account", async () => {
    const email = testEmail("bulky");
    const response = await new TestClient().request(
      "POST",
      "/api/auth/sign-up/email",
      JSON.stringify({ email, password: "correct-horse-battery", name: "z".repeat(100 * 1024) }),
    );
    expect(response.status).toBe(413);
    expect(await getUserByEmail(email)).toBeNull();
  });

  it("refuses a sign-up name over 120 characters, creating no account", async () => {
    const email = testEmail("longname");
    const response = await new TestClient().signUp({ name: "n".repeat(121), email });
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body)).toContain("Name must be 1 to 120 characters");
    expect(await getUserByEmail(email)).toBeNull();
  });

  it("refuses a form-encoded body posing as JSON (415) and a cross-site Origin (403)", async () => {
    const before = await workspaceCount();
    const plain = await owner.request("POST", "/api/workspaces", '{"name":"Forged Lab"}', { "content-type": "text/plain" });
    expect(plain.status).toBe(415);
    const foreign = await owner.request("POST", "/api/workspaces", { name: "Forged Lab" }, { origin: "https://elsewhere.example" });
    expect(foreign.status).toBe(403);
    expect(foreign.body).toMatchObject({ error: { code: "forbidden" } });
    expect(await workspaceCount()).toBe(before);
  });
});
