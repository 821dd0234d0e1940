import PgBoss from "pg-boss";
import { beforeAll, describe, expect, it } from "vitest";
import { countResiduals } from "@/db/queries/fit-residuals";
import { createFitWithFirstRevision, getRevision } from "@/db/queries/fits";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { env } from "@/lib/env";
import { parameterSetSchema } from "@/lib/export";
import { queueSchema, sendFitJob } from "@/lib/server/queues";
import { type Vec3, buildTemplate, compileModel, computeBands, templateKPath } from "@/lib/tb";
import { listMail } from "@/tests/support/mail";
import { type Team, createTeam } from "@/tests/support/workspace";
import { rebuiltBands } from "@/tests/unit/export/rebuild";
import {
  type RevisionBody,
  bandCsv,
  honeycombDataset,
  honeycombTruth,
  insertDataset,
  isFinal,
  longFit,
  siliconDataset,
  waitForRevision,
} from "./helpers";

// Fit runs through the routes alone, against the real PostgreSQL, pg-boss and the harness's worker (issue 5).

let team: Team;
let datasetId: string;
let fitId: string;
const base = () => `/api/workspaces/${team.slug}`;

beforeAll(async () => {
  team = await createTeam("Halvorsen Quantum Materials Lab");
  datasetId = await honeycombDataset(team.slug);
  const launched = await team.editor.post(`${base()}/fits`, {
    datasetId,
    name: "graphene pz",
    model: { template: "honeycomb-pz" },
    mapping: { kind: "offset", dataBands: [1, 2] },
    options: { notifyByEmail: true },
  });
  expect(launched.status, JSON.stringify(launched.body)).toBe(201);
  const body = launched.body as { fitId: string; revision: number; warnings: unknown[] };
  expect(body.revision).toBe(1);
  fitId = body.fitId;
});

describe("a fit on a fixture dataset", () => {
  let done: RevisionBody;
  it("succeeds and recovers the parameters the data were generated with", async () => {
    done = await waitForRevision(team.viewer, `${base()}/fits/${fitId}/revisions/1`, isFinal);
    expect(done.status).toBe("succeeded");
    expect(done.attempts).toBe(1);
    // exact synthetic data (helpers.honeycombDataset): the fit should land on the generating values
    for (const [name, value] of Object.entries(honeycombTruth))
      expect(done.result?.parameters.find((p) => p.name === name)?.value).toBeCloseTo(value, 5);
    expect(done.result?.rms).toBeLessThan(1e-6);
    // K's degeneracy is by symmetry, not a crossing: the count is there and 0
    expect(done.result?.crossings).toEqual({ tolerance: 1e-5, points: 0 });
  });

  it("stores one residual row per point used, paged and sorted in the database", async () => {
    const total = done.result?.pointsUsed ?? 0;
    expect(total).toBe(120); // 60 k-points × 2 bands
    const workspace = await getWorkspaceBySlug(team.slug);
    const revision = await getRevision({ workspaceId: workspace!.id, fitId, number: 1 });
    expect(await countResiduals({ revisionId: revision!.revision.id })).toBe(total);
    const page = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/residuals?band=2&page=2&pageSize=10&sort=-absResidual`);
    expect(page.status).toBe(200);
    const body = page.body as { rows: { dataBand: number; residual: number }[]; total: number };
    expect(body.total).toBe(60);
    expect(body.rows).toHaveLength(10);
    expect(body.rows.every((r) => r.dataBand === 2)).toBe(true);
    const abs = body.rows.map((r) => Math.abs(r.residual));
    expect(abs).toEqual([...abs].sort((a, b) => b - a));
    // by model energy, both ways: the rows come back in that order, ties broken by point index
    for (const [sort, sign] of [["modelEnergy", 1], ["-modelEnergy", -1]] as const) {
      const byModel = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/residuals?pageSize=1000&sort=${sort}`);
      expect(byModel.status).toBe(200);
      const rows = (byModel.body as { rows: { pointIndex: number; modelEnergy: number }[] }).rows;
      expect(rows).toHaveLength(total);
      const expected = [...rows].sort((a, b) => sign * (a.modelEnergy - b.modelEnergy) || a.pointIndex - b.pointIndex);
      expect(rows.map((r) => r.pointIndex)).toEqual(expected.map((r) => r.pointIndex));
    }
    const bad = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/residuals?sort=sideways`);
    expect(bad.status).toBe(422);
  });

  it("lists the fit and its revisions", async () => {
    const list = await team.viewer.get(`${base()}/fits`);
    expect((list.body as { fits: { id: string; latestStatus: string }[] }).fits.find((f) => f.id === fitId)?.latestStatus).toBe("succeeded");
    const one = await team.viewer.get(`${base()}/fits/${fitId}`);
    expect((one.body as { fit: { revisions: { number: number }[] } }).fit.revisions.map((r) => r.number)).toEqual([1]);
  });

  it("exports a parameter set that validates and whose hopping list alone rebuilds the fitted bands to 1e-9 eV", async () => {
    const exported = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/export`);
    expect(exported.status).toBe(200);
    const set = parameterSetSchema.parse(exported.body);
    expect(set.provenance.dataset.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(set.provenance.revision).toBe(1);
    const fitted = compileModel(done.result!.fittedModel);
    const k = templateKPath(done.result!.fittedModel, { totalPoints: 25 }).k;
    const { energies } = computeBands(fitted, undefined, k);
    k.forEach((kk, i) => rebuiltBands(set, kk).forEach((e, b) => expect(Math.abs(e - energies[i * 2 + b])).toBeLessThan(1e-9)));
  });

  it("serves the residuals and the model bands as CSV", async () => {
    const residuals = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/residuals.csv`);
    expect(residuals.headers.get("content-type")).toContain("text/csv");
    expect(String(residuals.body).trim().split("\n")).toHaveLength(121);
    const bands = await team.viewer.get(`${base()}/fits/${fitId}/revisions/1/bands.csv`);
    const lines = String(bands.body).trim().split("\n");
    // the path Γ–K–M–Γ starts and ends at Γ: 59 distinct k-points of the 60, × 2 bands
    expect(lines.filter((l) => l.startsWith("data,"))).toHaveLength(118);
    expect(lines.some((l) => l.startsWith("path,"))).toBe(true);
  });

  it("tells the launcher by e-mail, with a link to the revision page", async () => {
    const found = await mailFor(await emailOf("editor"), 'Fit "graphene pz" revision 1 finished');
    expect(found.text).toContain(`/w/${team.slug}/fits/${fitId}/revisions/1`);
    expect(found.text).toMatch(/RMS of the residuals: \d+\.\d meV/);
  });

  it("tells the launcher by e-mail when a revision fails, with the reason", async () => {
    // A stored revision whose window keeps no point: the route would refuse it, so it is written directly
    // and its job sent, as if the data had changed under a queued fit. The worker must end it failed.
    const workspace = await getWorkspaceBySlug(team.slug);
    const first = (await team.viewer.get(`${base()}/fits/${fitId}/revisions/1`)).body as { inputs: Record<string, unknown> };
    const me = (await team.editor.get("/api/auth/get-session")).body as { user: { id: string } };
    const boss = new PgBoss({ connectionString: env.DATABASE_URL, schema: queueSchema, supervise: false, schedule: false });
    await boss.start();
    let created: { fitId: string };
    try {
      created = await createFitWithFirstRevision({
        workspaceId: workspace!.id,
        datasetId,
        name: "graphene pz, empty window",
        notes: "",
        launchedBy: me.user.id,
        inputs: { ...first.inputs, window: { min: 100, max: 101 } },
        launchWarnings: [],
        sendJob: (revisionId, queue) => sendFitJob(boss, { revisionId, timeLimitMs: 60_000, marginSeconds: 15, db: queue }),
      });
    } finally {
      await boss.stop({ graceful: false });
    }
    const failed = await waitForRevision(team.viewer, `${base()}/fits/${created.fitId}/revisions/1`, isFinal);
    expect(failed.status).toBe("failed");
    expect(failed.failureReason).toContain("no longer pass the checks");
    const found = await mailFor(await emailOf("editor"), 'Fit "graphene pz, empty window" revision 1 failed');
    expect(found.text).toContain(`Reason: ${failed.failureReason}`);
    expect(found.text).toContain(`/w/${team.slug}/fits/${created.fitId}/revisions/1`);
  });

  it("starts revision 2 from revision 1's fitted values", async () => {
    const next = await team.editor.post(`${base()}/fits/${fitId}/revisions`, { from: 1, parameters: { "E_p[C]": { free: false } } });
    expect(next.status, JSON.stringify(next.body)).toBe(201);
    expect((next.body as { revision: number }).revision).toBe(2);
    const second = await waitForRevision(team.viewer, `${base()}/fits/${fitId}/revisions/2`, isFinal);
    expect(second.status).toBe("succeeded");
    const inputs = (await team.viewer.get(`${base()}/fits/${fitId}/revisions/2`)).body as {
      parentNumber: number;
      inputs: { model: { parameters: { name: string; value: number; free: boolean }[] } };
    };
    expect(inputs.parentNumber).toBe(1);
    const ep = inputs.inputs.model.parameters.find((p) => p.name === "E_p[C]");
    expect(ep?.free).toBe(false);
    expect(ep?.value).toBeCloseTo(honeycombTruth["E_p[C]"], 5);
  });
});

describe("a new revision with its own model", () => {
  it("applies the parameter edits to the model given, not to the copied one", async () => {
    const next = await team.editor.post(`${base()}/fits/${fitId}/revisions`, {
      from: 1,
      model: { template: "honeycomb-pz", parameters: { t1: { value: 2.4 } } },
      parameters: { t1: { value: 2.5, free: false } },
    });
    expect(next.status, JSON.stringify(next.body)).toBe(201);
    const number = (next.body as { revision: number }).revision;
    const path = `${base()}/fits/${fitId}/revisions/${number}`;
    const body = (await team.viewer.get(path)).body as { inputs: { model: { parameters: { name: string; value: number; free: boolean }[] } } };
    const t1 = body.inputs.model.parameters.find((p) => p.name === "t1");
    expect(t1).toMatchObject({ value: 2.5, free: false });
    // E_p[C] comes from the template given (its default 0), not from revision 1's fit (0.1)
    expect(body.inputs.model.parameters.find((p) => p.name === "E_p[C]")?.value).toBe(0);
    const unknown = await team.editor.post(`${base()}/fits/${fitId}/revisions`, {
      from: 1,
      model: { template: "honeycomb-pz" },
      parameters: { "V_ssσ[Si–Si,1]": { value: 1 } },
    });
    expect(unknown.status).toBe(422);
    expect(JSON.stringify(unknown.body)).toContain('the model has no parameter \\"V_ssσ[Si–Si,1]\\"');
    expect((await waitForRevision(team.viewer, path, isFinal)).status).toBe("succeeded");
  });
});

describe("the frame check", () => {
  it("warns at launch when the data's labelled points sit where the model has other points, and stores the warning", async () => {
    // The honeycomb bands written in a frame turned by 30°: the data's M lands on the model's Γ–K line.
    const turn = (k: Vec3): Vec3 => {
      const [c, s] = [Math.cos(Math.PI / 6), Math.sin(Math.PI / 6)];
      return [c * k[0] - s * k[1], s * k[0] + c * k[1], k[2]];
    };
    const model = buildTemplate("honeycomb-pz");
    const turned = bandCsv(model, 60, turn);
    expect(turned.vertices.map((v) => v.label)).toEqual(["Γ", "M", "K", "Γ"]);
    const turnedId = await insertDataset(team.slug, "graphene cut, turned cell", turned.csv, turned.vertices);
    const launched = await team.editor.post(`${base()}/fits`, { datasetId: turnedId, name: "turned", model: { template: "honeycomb-pz" } });
    expect(launched.status, JSON.stringify(launched.body)).toBe(201);
    const { fitId: turnedFit, warnings } = launched.body as { fitId: string; warnings: { kind: string; message: string }[] };
    expect(warnings).toHaveLength(1);
    expect(warnings[0].kind).toBe("frame-mismatch");
    expect(warnings[0].message).toMatch(/M at k = .* from the model's nearest M; K at k = .* from the model's nearest K/);
    const stored = (await team.viewer.get(`${base()}/fits/${turnedFit}/revisions/1`)).body as { launchWarnings: unknown };
    expect(stored.launchWarnings).toEqual(warnings);

    // the same data in the model's own frame: no warning
    const own = bandCsv(model, 60);
    const ownId = await insertDataset(team.slug, "graphene cut, model cell", own.csv, own.vertices);
    const plain = await team.editor.post(`${base()}/fits`, { datasetId: ownId, name: "own frame", model: { template: "honeycomb-pz" } });
    expect(plain.status).toBe(201);
    expect((plain.body as { warnings: unknown[] }).warnings).toEqual([]);
    for (const id of [turnedFit, (plain.body as { fitId: string }).fitId]) await waitForRevision(team.viewer, `${base()}/fits/${id}/revisions/1`, isFinal);
  });
});

describe("cancellation", () => {
  it("stops a running fit within about a second and keeps its best point", async () => {
    const silicon = await siliconDataset(team.slug);
    const launched = await team.editor.post(`${base()}/fits`, longFit(silicon, 30_000));
    expect(launched.status, JSON.stringify(launched.body)).toBe(201);
    const path = `${base()}/fits/${(launched.body as { fitId: string }).fitId}/revisions/1`;
    await waitForRevision(team.viewer, path, (b) => b.status === "running" && b.progress !== null, 20_000);
    const viewerCancel = await team.viewer.post(`${path}/cancel`);
    expect(viewerCancel.status).toBe(403);
    const asked = Date.now();
    const cancel = await team.editor.post(`${path}/cancel`);
    expect(cancel.status).toBe(200);
    const ended = await waitForRevision(team.viewer, path, isFinal, 10_000);
    // 1 s for the fit to notice (250 ms polling + one iteration) plus the result write and our 200 ms polling
    expect(Date.now() - asked).toBeLessThan(3000);
    expect(ended.status).toBe("cancelled");
    expect(ended.result?.cancelled).toBe(true);
    expect(ended.result?.parameters.length).toBeGreaterThan(0);
  });
});

/** The first mail to `to` whose subject starts with `subject`, waiting up to 10 s for it. */
async function mailFor(to: string, subject: string): Promise<{ text: string }> {
  const deadline = Date.now() + 10_000;
  while (Date.now() < deadline) {
    const found = (await listMail()).find((m) => m.to.includes(to) && m.subject.startsWith(subject));
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`no mail "${subject}" to ${to}`);
}

async function emailOf(role: "editor"): Promise<string> {
  const me = await team[role].get("/api/auth/get-session");
  return (me.body as { user: { email: string } }).user.email;
}
