import { beforeAll, describe, expect, it } from "vitest";
import { type Team, createTeam } from "@/tests/support/workspace";
import { buildTemplate } from "@/lib/tb";
import { type RevisionBody, bandCsv, honeycombDataset, insertDataset, isFinal, longFit, siliconDataset, waitForRevision } from "./helpers";

// The fits list (issue 6 item 4): name, dataset, latest revision's status and RMS, who and when — per
// workspace and per dataset (`?dataset=<id>`).

type FitRow = {
  id: string;
  name: string;
  datasetId: string;
  datasetName: string;
  createdByName: string | null;
  createdAt: string;
  latestRevision: number | null;
  latestStatus: string | null;
  latestRms: number | null;
  latestFinishedAt: string | null;
};

let team: Team;
let other: Team;
let graphene: string;
let grapheneB: string;
let foreignDataset: string;
const base = () => `/api/workspaces/${team.slug}`;
const ids: Record<"first" | "second" | "onB", string> = { first: "", second: "", onB: "" };
let latestOfFirst: RevisionBody;

async function launched(client: Team["owner"], body: Record<string, unknown>): Promise<string> {
  const response = await client.post(`${base()}/fits`, { model: { template: "honeycomb-pz" }, ...body });
  expect(response.status).toBe(201);
  return (response.body as { fitId: string }).fitId;
}

const list = async (client: Team["owner"], query = "") => {
  const response = await client.get(`${base()}/fits${query}`);
  expect(response.status).toBe(200);
  return (response.body as { fits: FitRow[] }).fits;
};

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  other = await createTeam("Another lab");
  graphene = await honeycombDataset(team.slug, "Halvorsen graphene cut A");
  // another cut (fewer k-points, so another file hash: a workspace holds each file once)
  grapheneB = await insertDataset(team.slug, "Halvorsen graphene cut B", bandCsv(buildTemplate("honeycomb-pz"), 40).csv);
  foreignDataset = await honeycombDataset(other.slug, "Other lab's graphene");

  ids.first = await launched(team.editor, { datasetId: graphene, name: "pz, two revisions" });
  await waitForRevision(team.owner, `${base()}/fits/${ids.first}/revisions/1`, isFinal);
  // Revision 2 starts from revision 1's fitted values with t1 fixed: its RMS differs from revision 1's.
  const second = await team.owner.post(`${base()}/fits/${ids.first}/revisions`, { from: 1, parameters: { t1: { value: 2.7, free: false } } });
  expect(second.status).toBe(201);
  latestOfFirst = await waitForRevision(team.owner, `${base()}/fits/${ids.first}/revisions/2`, isFinal);

  ids.second = await launched(team.owner, { datasetId: graphene, name: "pz, one revision" });
  ids.onB = await launched(team.editor, { datasetId: grapheneB, name: "pz on cut B" });
  await waitForRevision(team.owner, `${base()}/fits/${ids.second}/revisions/1`, isFinal);
  await waitForRevision(team.owner, `${base()}/fits/${ids.onB}/revisions/1`, isFinal);
  // another workspace's fit, which the list must never show
  const foreign = await other.owner.post(`/api/workspaces/${other.slug}/fits`, { datasetId: foreignDataset, name: "foreign", model: { template: "honeycomb-pz" } });
  expect(foreign.status).toBe(201);
});

describe("GET /fits", () => {
  it("lists the workspace's fits newest first with dataset, creator and the latest revision's status, RMS and finish time", async () => {
    const fits = await list(team.viewer);
    expect(fits.map((f) => f.id)).toEqual([ids.onB, ids.second, ids.first]);
    const first = fits.find((f) => f.id === ids.first)!;
    expect(first).toMatchObject({
      name: "pz, two revisions",
      datasetId: graphene,
      datasetName: "Halvorsen graphene cut A",
      createdByName: "Test editor",
      latestRevision: 2,
      latestStatus: latestOfFirst.status,
    });
    // the latest revision's own RMS (eV), not revision 1's
    expect(latestOfFirst.status).toBe("succeeded");
    expect(first.latestRms).toBe(latestOfFirst.result!.rms);
    expect(first.latestFinishedAt).not.toBeNull();
    const revision1 = (await team.viewer.get(`${base()}/fits/${ids.first}/revisions/1`)).body as RevisionBody;
    expect(first.latestRms).not.toBe(revision1.result!.rms);
    expect(Date.parse(first.latestFinishedAt!)).toBeGreaterThanOrEqual(Date.parse(first.createdAt));
    expect(fits.find((f) => f.id === ids.second)).toMatchObject({ createdByName: "Test owner", latestRevision: 1, datasetName: "Halvorsen graphene cut A" });
  });

  it("?dataset=<id> keeps that dataset's fits only", async () => {
    expect((await list(team.viewer, `?dataset=${graphene}`)).map((f) => f.id)).toEqual([ids.second, ids.first]);
    expect((await list(team.viewer, `?dataset=${grapheneB}`)).map((f) => [f.id, f.datasetName])).toEqual([[ids.onB, "Halvorsen graphene cut B"]]);
  });

  it("a dataset of another workspace lists nothing; a malformed id is refused", async () => {
    expect(await list(team.owner, `?dataset=${foreignDataset}`)).toEqual([]);
    const malformed = await team.owner.get(`${base()}/fits?dataset=not-an-id`);
    expect(malformed.status).toBe(422);
    expect((malformed.body as { error: { message: string } }).error.message).toMatch(/dataset/);
  });

  it("a fit whose latest revision has not finished shows no RMS and no finish time", async () => {
    const silicon = await siliconDataset(team.slug);
    const response = await team.editor.post(`${base()}/fits`, longFit(silicon, 20_000));
    expect(response.status).toBe(201);
    const long = (response.body as { fitId: string }).fitId;
    const row = (await list(team.viewer, `?dataset=${silicon}`)).find((f) => f.id === long)!;
    expect(row).toMatchObject({ latestRevision: 1, latestRms: null, latestFinishedAt: null, datasetName: "Halvorsen Si sample 7" });
    expect(["queued", "running"]).toContain(row.latestStatus);
    expect((await team.editor.post(`${base()}/fits/${long}/revisions/1/cancel`)).status).toBe(200);
    await waitForRevision(team.owner, `${base()}/fits/${long}/revisions/1`, isFinal);
  });
});
