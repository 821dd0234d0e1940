import { beforeAll, describe, expect, it } from "vitest";
import { listFits } from "@/db/queries/fits";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { type Team, createTeam } from "@/tests/support/workspace";
import { honeycombDataset, isFinal, waitForRevision } from "./helpers";

// Roles on every fit route (viewer reads and exports; editor+ launches and cancels; non-member 404;
// signed out 401) and launch input refused before anything is stored (issue 5).

let team: Team;
let other: Team;
let datasetId: string;
let otherDatasetId: string;
let fitId: string;
const base = () => `/api/workspaces/${team.slug}`;
const launch = (overrides: Record<string, unknown> = {}) => ({ datasetId, name: "pz", model: { template: "honeycomb-pz" }, ...overrides });

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  other = await createTeam("Another lab");
  datasetId = await honeycombDataset(team.slug);
  otherDatasetId = await honeycombDataset(other.slug);
  const launched = await team.owner.post(`${base()}/fits`, launch());
  expect(launched.status).toBe(201);
  fitId = (launched.body as { fitId: string }).fitId;
  await waitForRevision(team.owner, `${base()}/fits/${fitId}/revisions/1`, isFinal);
});

type Caller = "owner" | "editor" | "viewer" | "outsider" | "anonymous";
const reads = ["", "/{fit}", "/{fit}/revisions/1", "/{fit}/revisions/1/residuals", "/{fit}/revisions/1/export", "/{fit}/revisions/1/residuals.csv", "/{fit}/revisions/1/bands.csv"];

describe("roles", () => {
  it.each(reads)("GET fits%s: members 200, non-member 404, signed out 401", async (suffix) => {
    const path = `${base()}/fits${suffix.replace("{fit}", fitId)}`;
    const expected: Record<Caller, number> = { owner: 200, editor: 200, viewer: 200, outsider: 404, anonymous: 401 };
    for (const caller of Object.keys(expected) as Caller[]) expect([caller, (await team[caller].get(path)).status]).toEqual([caller, expected[caller]]);
  });

  it("launching, new revisions and cancelling need editor: viewer 403, non-member 404, signed out 401", async () => {
    const writes = [
      { path: `${base()}/fits`, body: launch() },
      { path: `${base()}/fits/${fitId}/revisions`, body: { from: 1 } },
      { path: `${base()}/fits/${fitId}/revisions/1/cancel`, body: {} },
    ];
    for (const { path, body } of writes) {
      expect((await team.viewer.post(path, body)).status).toBe(403);
      expect((await team.outsider.post(path, body)).status).toBe(404);
      expect((await team.anonymous.post(path, body)).status).toBe(401);
    }
    // cancelling a finished revision is allowed to an editor and leaves it as it was
    const cancel = await team.editor.post(`${base()}/fits/${fitId}/revisions/1/cancel`);
    expect(cancel.body).toEqual({ status: "succeeded" });
  });

  it("another workspace's fit is 404 even to a member of both routes' workspace", async () => {
    expect((await other.owner.get(`/api/workspaces/${other.slug}/fits/${fitId}`)).status).toBe(404);
  });

  it("GET /api/templates lists the templates to signed-in users", async () => {
    const response = await team.viewer.get("/api/templates");
    const templates = (response.body as { templates: { id: string; orbitals: number; kPath: unknown[] }[] }).templates;
    expect(templates.find((t) => t.id === "diamond-sp3s-star")?.orbitals).toBe(10);
    expect((await team.anonymous.get("/api/templates")).status).toBe(401);
  });
});

describe("bad launch input is refused before anything is stored", () => {
  const cases: Array<[string, () => Record<string, unknown>, RegExp]> = [
    ["an unknown dataset", () => launch({ datasetId: "no-such-dataset" }), /no dataset/],
    ["another workspace's dataset", () => launch({ datasetId: otherDatasetId }), /no dataset/],
    ["a model that does not validate", () => launch({ model: { template: "honeycomb-pz", parameters: { t9: { value: 1 } } } }), /no parameter "t9"/],
    ["a mapping to a band the model lacks", () => launch({ mapping: { kind: "offset", dataBands: [1, 2], firstModelBand: 2 } }), /band/],
    ["an empty window", () => launch({ window: { min: 40, max: 50 } }), /window|point/],
  ];
  it.each(cases)("%s → 4xx with a clear message, no revision", async (_label, body, message) => {
    const workspace = await getWorkspaceBySlug(team.slug);
    const before = (await listFits({ workspaceId: workspace!.id })).length;
    const response = await team.editor.post(`${base()}/fits`, body());
    expect(response.status).toBeGreaterThanOrEqual(400);
    expect(response.status).toBeLessThan(500);
    expect((response.body as { error: { message: string } }).error.message).toMatch(message);
    expect((await listFits({ workspaceId: workspace!.id })).length).toBe(before);
  });
});
