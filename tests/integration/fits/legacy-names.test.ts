import { beforeAll, describe, expect, it } from "vitest";
import { parameterSetSchema } from "@/lib/export";
import { revisionDetailsSchema } from "@/lib/views/responses";
import { type Team, createTeam } from "@/tests/support/workspace";
import { type RevisionBody, insertLegacyRevision, isFinal, waitForRevision } from "./helpers";

// A revision stored before bond integrals were spelled V_ppπ[Si–Si,1] (issue 11, item 14): its snapshot
// and result (tests/support/legacy-spelling-revision.json) name them V_pp_pi[Si-Si,1]. It is written straight
// into the database as the worker stored it then (helpers.insertLegacyRevision); the revision route, the
// export and "new revision from this one" must all work on it, in today's names. The browser test
// legacy-revision.test.ts opens its page and its new-revision form.

let team: Team;
let fitId: string;
const base = () => `/api/workspaces/${team.slug}`;

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  fitId = await insertLegacyRevision(team);
});

describe("a revision stored in the earlier spelling", () => {
  it("is served in today's names, and the revision page's schema reads it", async () => {
    const response = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1`);
    expect(response.status).toBe(200);
    const body = revisionDetailsSchema.parse(response.body);
    const names = body.result!.parameters.map((p) => p.name);
    expect(names).toContain("V_ppπ[Si–Si,1]");
    expect(names.join(" ")).not.toMatch(/_sigma|_pi\[/);
    expect(body.inputs.model.parameters.map((p) => p.name)).toContain("V_s*pσ[Si–Si,1]");
    expect(body.result!.correlation.names).toContain("V_ssσ[Si–Si,1]");
    expect(body.result!.fittedModel.parameters.find((p) => p.name === "V_ppπ[Si–Si,1]")?.integral).toMatchObject({ bond: "pp", kind: "π" });
  });

  it("exports a valid version-2 parameter set with today's names and the dataset's energy zero", async () => {
    const response = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/export`);
    expect(response.status).toBe(200);
    const set = parameterSetSchema.parse(response.body);
    expect(set.version).toBe(2);
    expect(set.parameters.map((p) => p.name)).toContain("V_ppπ[Si–Si,1]");
    expect(set.bonds.some((b) => b.parameters.some((c) => c.name === "V_spσ[Si–Si,1]"))).toBe(true);
    expect(set.energyAlignment.dataEnergyZero).toBe("valence-band maximum");
    expect(set.fit.crossingTolerance).toBeNull(); // fitted before crossings were treated
    expect((await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/bands.csv`)).status).toBe(200);
  });

  it("starts a new revision from it, with edits named in either spelling, and the new revision runs", async () => {
    const next = await team.editor.post(`${base()}/fits/${fitId}/revisions`, {
      from: 1,
      parameters: { "V_pp_pi[Si-Si,1]": { value: -1.2, free: false }, "V_ssσ[Si–Si,1]": { value: -1.9 } },
    });
    expect(next.status, JSON.stringify(next.body)).toBe(201);
    const path = `${base()}/fits/${fitId}/revisions/${(next.body as { revision: number }).revision}`;
    const done = (await waitForRevision(team.viewer, path, isFinal)) as RevisionBody & { inputs: { model: { parameters: { name: string; value: number; free: boolean }[] } } };
    expect(done.status).toBe("succeeded");
    expect(done.inputs.model.parameters.find((p) => p.name === "V_ppπ[Si–Si,1]")).toMatchObject({ value: -1.2, free: false });
    expect(done.inputs.model.parameters.find((p) => p.name === "V_ssσ[Si–Si,1]")?.value).toBe(-1.9);
    expect(done.result?.parameters.map((p) => p.name)).toContain("V_s*pσ[Si–Si,1]");
  });
});
