import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { honeycombDataset } from "@/tests/integration/fits/helpers";
import type { TestClient } from "@/tests/support/client";
import { type Team, createTeam } from "@/tests/support/workspace";

// Fit and dataset pages answer 404 from the server (not 200 with an empty shell) for an unknown id, another
// workspace's id, a malformed id and an unknown or out-of-range revision number (issue 11 §3).

let team: Team;
let other: Team;
let fitId: string;
let otherFitId: string;
let datasetId: string;
let otherDatasetId: string;

async function launchFit(client: TestClient, slug: string, dataset: string): Promise<string> {
  const launched = await client.post(`/api/workspaces/${slug}/fits`, { datasetId: dataset, name: "pz", model: { template: "honeycomb-pz" } });
  expect(launched.status).toBe(201);
  return (launched.body as { fitId: string }).fitId;
}

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  other = await createTeam("Another lab");
  datasetId = await honeycombDataset(team.slug);
  otherDatasetId = await honeycombDataset(other.slug);
  fitId = await launchFit(team.editor, team.slug, datasetId);
  otherFitId = await launchFit(other.editor, other.slug, otherDatasetId);
});

/** The four fit pages of `fit`, with revision number (or query) `n`. */
const fitPages = (fit: string, n: string) => [
  `fits/${fit}`,
  `fits/${fit}/revisions/${n}`,
  `fits/${fit}/revisions/new?from=${n}`,
  `fits/${fit}/compare?a=1&b=${n}`,
];

async function statusOf(client: TestClient, path: string): Promise<[string, number]> {
  return [path, (await client.get(`/w/${team.slug}/${path}`)).status];
}

describe("fit pages", () => {
  it("answer 200 for the workspace's own fit and revision", async () => {
    for (const path of fitPages(fitId, "1")) expect(await statusOf(team.editor, path)).toEqual([path, 200]);
  });

  const badFits: Array<[string, () => string]> = [
    ["an unknown fit id", () => randomUUID()],
    ["another workspace's fit", () => otherFitId],
    ["a malformed fit id", () => "not%20a%20fit%3B"],
  ];
  it.each(badFits)("answer 404 for %s", async (_label, fit) => {
    for (const path of fitPages(fit(), "1")) expect(await statusOf(team.editor, path)).toEqual([path, 404]);
  });

  // 2: the next number, not launched; 2147483648 = 2³¹ and 99999999999 lie beyond PostgreSQL's integer
  // (int4, at most 2³¹ − 1; PostgreSQL 15 manual §8.1.1), which answered 500 before.
  it.each(["2", "0", "-1", "1.5", "1e0", "01", "abc", "2147483647", "2147483648", "99999999999"])(
    "answer 404 for revision number %s",
    async (n) => {
      for (const path of fitPages(fitId, n).slice(1)) expect(await statusOf(team.editor, path)).toEqual([path, 404]);
    },
  );

  it("the revision routes answer 404, not 500, for an out-of-range revision number", async () => {
    for (const n of ["2147483648", "99999999999"]) {
      const response = await team.viewer.get(`/api/workspaces/${team.slug}/fits/${fitId}/revisions/${n}`);
      expect([n, response.status]).toEqual([n, 404]);
    }
  });
});

describe("dataset page", () => {
  it("answers 200 for the workspace's dataset and 404 for an unknown, foreign or malformed id", async () => {
    expect(await statusOf(team.viewer, `datasets/${datasetId}`)).toEqual([`datasets/${datasetId}`, 200]);
    for (const id of [randomUUID(), otherDatasetId, "not-a-dataset", "99999999999"]) {
      expect(await statusOf(team.viewer, `datasets/${id}`)).toEqual([`datasets/${id}`, 404]);
    }
  });
});
