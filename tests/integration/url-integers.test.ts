import { beforeAll, describe, expect, it } from "vitest";
import { type Team, createTeam } from "@/tests/support/workspace";
import { honeycombDataset, isFinal, waitForRevision } from "./fits/helpers";

// Issue 11, item 10: every whole number that reaches SQL from a URL under app/api (the points route's band,
// page and pageSize, chart-points' max, the residuals' band, page and pageSize, the revision number of every
// route below …/revisions/{n}) answers 4xx when it is out of the int4 range (2³¹ − 1 = 2 147 483 647,
// PostgreSQL 15 manual §8.1.1), negative, zero or not an integer — never 500. So does `from` of a new
// revision (JSON body). Queries: 422 naming the parameter; a revision number no revision can have: 404.

let team: Team;
let datasetId: string;
let fitId: string;
const base = () => `/api/workspaces/${team.slug}`;

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  datasetId = await honeycombDataset(team.slug);
  const launched = await team.editor.post(`${base()}/fits`, { datasetId, name: "pz", model: { template: "honeycomb-pz" } });
  expect(launched.status).toBe(201);
  fitId = (launched.body as { fitId: string }).fitId;
  await waitForRevision(team.viewer, `${base()}/fits/${fitId}/revisions/1`, isFinal);
});

const badIntegers = ["99999999999", "2147483648", "4294967297", "1e20", "-1", "0", "1.5", "abc", ""];

type ErrorBody = { error: { code: string; message: string; issues?: Record<string, string[]> } };

describe("query integers", () => {
  const queries: [string, () => string, string[]][] = [
    ["GET …/datasets/{id}/points", () => `${base()}/datasets/${datasetId}/points`, ["band", "page", "pageSize"]],
    ["GET …/datasets/{id}/chart-points", () => `${base()}/datasets/${datasetId}/chart-points`, ["max"]],
    ["GET …/revisions/{n}/residuals", () => `${base()}/fits/${fitId}/revisions/1/residuals`, ["band", "page", "pageSize"]],
  ];

  it.each(queries)("%s answers 422 naming the parameter, never 500", async (_, path, parameters) => {
    for (const parameter of parameters)
      for (const value of badIntegers) {
        const response = await team.viewer.get(`${path()}?${parameter}=${encodeURIComponent(value)}`);
        expect([parameter, value, response.status]).toEqual([parameter, value, 422]);
        const body = response.body as ErrorBody;
        expect(body.error.code).toBe("validation_failed");
        expect(Object.keys(body.error.issues ?? {})).toEqual([parameter]);
        expect(body.error.message).toMatch(new RegExp(`^${parameter} must be `));
      }
  });

  it("the largest int4 is a valid page and band: an empty page, not an error", async () => {
    const points = await team.viewer.get(`${base()}/datasets/${datasetId}/points?page=2147483647&band=2147483647&pageSize=500`);
    expect(points.status).toBe(200);
    expect(points.body).toMatchObject({ points: [], total: 0, page: 2147483647, pageSize: 500 });
    const residuals = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/residuals?page=2147483647&pageSize=1000`);
    expect(residuals.status).toBe(200);
    expect((residuals.body as { rows: unknown[]; total: number }).rows).toEqual([]);
    expect((residuals.body as { total: number }).total).toBeGreaterThan(0);
  });
});

describe("revision numbers in the path", () => {
  const routes = ["", "/residuals", "/export", "/residuals.csv", "/bands.csv"];
  const badNumbers = ["99999999999", "2147483648", "4294967297", "1e20", "-1", "0", "1.5", "01", "abc"];

  it.each(routes)("GET …/revisions/{n}%s answers 404 for a number no revision can have", async (suffix) => {
    for (const n of badNumbers) {
      const response = await team.viewer.get(`${base()}/fits/${fitId}/revisions/${encodeURIComponent(n)}${suffix}`);
      expect([n, response.status]).toEqual([n, 404]);
      expect((response.body as ErrorBody).error.code).toBe("not_found");
    }
    // the largest int4 is a well-formed number of a revision that does not exist
    expect((await team.viewer.get(`${base()}/fits/${fitId}/revisions/2147483647${suffix}`)).status).toBe(404);
    expect((await team.viewer.get(`${base()}/fits/${fitId}/revisions/1${suffix}`)).status).toBe(200);
  });

  it("POST …/revisions/{n}/cancel answers 404 for a number no revision can have", async () => {
    for (const n of badNumbers) expect([n, (await team.editor.post(`${base()}/fits/${fitId}/revisions/${encodeURIComponent(n)}/cancel`)).status]).toEqual([n, 404]);
  });

  it("POST …/revisions with from out of range answers 422, and stores nothing", async () => {
    const before = ((await team.viewer.get(`${base()}/fits/${fitId}`)).body as { fit: { revisions: unknown[] } }).fit.revisions.length;
    for (const from of [99999999999, 2147483648, -1, 0, 1.5]) {
      const response = await team.editor.post(`${base()}/fits/${fitId}/revisions`, { from });
      expect([from, response.status]).toEqual([from, 422]);
      expect(Object.keys((response.body as ErrorBody).error.issues ?? {})).toEqual(["from"]);
    }
    const after = ((await team.viewer.get(`${base()}/fits/${fitId}`)).body as { fit: { revisions: unknown[] } }).fit.revisions.length;
    expect(after).toBe(before);
  });
});
