// Shared pieces of the fit-run integration tests: a dataset inserted the way an upload stores it (a CSV
// parsed with parseDispersionFile, then the dataset and point rows), polling revisions through the
// routes, and worker processes of the tests' own.
import { type ChildProcess, spawn } from "node:child_process";
import { createHash, randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { getDatasetForFit } from "@/db/queries/fit-data";
import { claimRevision, createFitWithFirstRevision, finishRevision } from "@/db/queries/fits";
import { getWorkspaceBySlug } from "@/db/queries/workspaces";
import { sql } from "drizzle-orm";
import { dataset, datasetPoint, fitRevision } from "@/db/schema";
import { parseDispersionFile } from "@/lib/datasets";
import { type ModelDocument, type Vec3, buildTemplate, compileModel, computeBands, templateKPath } from "@/lib/tb";
import type { TestClient } from "@/tests/support/client";
import type { Team } from "@/tests/support/workspace";

/**
 * Long-format CSV of every band of `doc` at its own values along its k-path (Cartesian 1/Å, eV), with the
 * path's vertices. `frame` turns the written k (the energies stay those of the model's own k), as data
 * computed in a differently oriented cell would be.
 */
export function bandCsv(doc: ModelDocument, kCount: number, frame: (k: Vec3) => Vec3 = (k) => k): { csv: string; k: Vec3[]; vertices: LabelledPoint[] } {
  const path = templateKPath(doc, { totalPoints: kCount });
  const compiled = compileModel(doc);
  const { energies } = computeBands(compiled, undefined, path.k);
  const n = compiled.orbitalCount;
  const lines = ["kx,ky,kz,band,energy"];
  path.k.forEach((kk, i) => {
    for (let b = 0; b < n; b++) lines.push(`${frame(kk).join(",")},${b + 1},${energies[i * n + b]}`);
  });
  const vertices = path.ticks.map((t) => ({ label: t.label, k: frame(path.k[t.index]) }));
  return { csv: lines.join("\n") + "\n", k: path.k, vertices };
}

/** A labelled point of an upload mapping (Cartesian 1/Å), which the dataset stores as an axis tick. */
export type LabelledPoint = { label: string; k: Vec3 };

/** Inserts a dataset parsed from `csv` into the workspace, with ticks at `labelled` points; returns its id. */
export async function insertDataset(slug: string, name: string, csv: string, labelled: LabelledPoint[] = []): Promise<string> {
  const workspace = await getWorkspaceBySlug(slug);
  if (!workspace) throw new Error(`no workspace ${slug}`);
  const mapping = {
    name,
    source: "calculation" as const,
    format: "long" as const,
    delimiter: "auto" as const,
    k: {
      kind: "cartesian" as const,
      columns: ["kx", "ky", "kz"],
      ...(labelled.length ? { path: labelled.map((p) => ({ label: p.label, k: [...p.k], coordinates: "cartesian" as const })) } : {}),
    },
    band: { column: "band" },
    energy: { column: "energy", unit: "eV" as const },
  };
  const parsed = await parseDispersionFile(csv, mapping);
  if (!parsed.ok) throw new Error(`fixture did not parse: ${JSON.stringify(parsed.issues)}`);
  const id = randomUUID();
  const bytes = Buffer.from(csv);
  await db.insert(dataset).values({
    id,
    workspaceId: workspace.id,
    name,
    source: "calculation",
    mapping,
    summary: parsed.summary,
    fileName: `${name}.csv`,
    fileType: "text/csv",
    fileSize: bytes.length,
    fileSha256: createHash("sha256").update(bytes).digest("hex"),
    fileBytes: bytes,
    pointCount: parsed.points.length,
    bandCount: parsed.summary.bandCount,
  });
  await db.insert(datasetPoint).values(
    parsed.points.map((p, index) => ({
      datasetId: id,
      index,
      row: p.row,
      kIndex: p.kIndex,
      kx: p.k[0],
      ky: p.k[1],
      kz: p.k[2],
      pathDistance: p.pathDistance,
      band: p.band,
      energy: p.energy,
    })),
  );
  return id;
}

/** A honeycomb pz dataset generated at t1 = 2.6 eV, E_p = 0.1 eV (the template starts from 2.8 and 0). */
export const honeycombTruth = { t1: 2.6, "E_p[C]": 0.1 };
export async function honeycombDataset(slug: string, name = "Halvorsen graphene cut"): Promise<string> {
  const doc = buildTemplate("honeycomb-pz", { parameters: { t1: { value: honeycombTruth.t1 }, "E_p[C]": { value: honeycombTruth["E_p[C]"] } } });
  return insertDataset(slug, name, bandCsv(doc, 60).csv);
}

/** A silicon sp3s* dataset (template values, 8 bands) for fits that must run for a while. */
export async function siliconDataset(slug: string, name = "Halvorsen Si sample 7"): Promise<string> {
  return insertDataset(slug, name, bandCsv(buildTemplate("diamond-sp3s-star"), 80).csv);
}

/**
 * A revision stored before bond integrals were spelled V_ppπ[Si–Si,1]: the snapshot and result of
 * tests/support/legacy-spelling-revision.json (made with the code of f0e7d08: sp3s* Si, bands 1–4, names
 * such as V_pp_pi[Si-Si,1]), written as the worker wrote results then, on a silicon dataset whose energy
 * reference is the valence-band maximum. Returns the fit's id; the revision is number 1, succeeded.
 */
export async function insertLegacyRevision(team: Team): Promise<string> {
  const legacy = JSON.parse(readFileSync("tests/support/legacy-spelling-revision.json", "utf8"));
  const workspace = (await getWorkspaceBySlug(team.slug))!;
  const datasetId = await siliconDataset(team.slug, "Halvorsen Si sample 7 (2024)");
  await db.update(dataset).set({ energyReference: "valence-band maximum" }).where(eq(dataset.id, datasetId));
  const stored = (await getDatasetForFit({ workspaceId: workspace.id, datasetId }))!;
  const me = (await team.editor.get("/api/auth/get-session")).body as { user: { id: string } };
  const created = await createFitWithFirstRevision({
    workspaceId: workspace.id,
    datasetId,
    name: "sp3s* from 2024",
    notes: "",
    launchedBy: me.user.id,
    inputs: { ...legacy.inputs, dataset: { id: stored.id, name: stored.name, sha256: stored.sha256 } },
    launchWarnings: [],
    // no queue job: the result is written below, as a worker of the time wrote it
    sendJob: async () => "no job (stored before issue 11)",
  });
  const attempt = await claimRevision({ revisionId: created.revisionId, runner: "2024 worker" });
  if (!attempt || !(await finishRevision({ revisionId: created.revisionId, attempt, status: "succeeded", result: legacy.result, residuals: [] })))
    throw new Error("the legacy revision could not be stored");
  return created.fitId;
}

/**
 * Launch body of a fit that runs until its time limit: many starts on sp3s* silicon from perturbed
 * values, so that it is mid-fit whenever a test acts on it.
 */
export function longFit(datasetId: string, timeLimitMs: number) {
  return {
    datasetId,
    name: "long silicon fit",
    model: { template: "diamond-sp3s-star", parameters: { "E_s[Si]": { value: -3.5 }, "V_ssσ[Si–Si,1]": { value: -1.6 } } },
    mapping: { kind: "offset", dataBands: [1, 8] },
    options: { starts: 1000, timeLimitMs, maxIterations: 200 },
  };
}

export type RevisionBody = {
  status: string;
  attempts: number;
  runner: string | null;
  progress: unknown;
  failureReason: string | null;
  result: null | {
    rms: number;
    cancelled: boolean;
    pointsUsed: number;
    crossings?: { tolerance: number; points: number };
    parameters: { name: string; value: number; standardError: number | null }[];
    fittedModel: ModelDocument;
    warnings: unknown[];
    stopReason: string;
  };
};

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Polls a revision until `done(body)` holds; throws after `timeoutMs`. */
export async function waitForRevision(
  client: TestClient,
  path: string,
  done: (body: RevisionBody) => boolean,
  timeoutMs = 30_000,
): Promise<RevisionBody> {
  const deadline = Date.now() + timeoutMs;
  let last: unknown;
  while (Date.now() < deadline) {
    const response = await client.get(path);
    last = response.body;
    if (response.status === 200 && done(response.body as RevisionBody)) return response.body as RevisionBody;
    await sleep(200);
  }
  throw new Error(`revision ${path} did not reach the expected state: ${JSON.stringify(last).slice(0, 500)}`);
}

export const isFinal = (b: RevisionBody) => ["succeeded", "failed", "cancelled"].includes(b.status);

/** Starts a worker process of the test's own (node itself, so that its PID is the worker's). */
export function startWorker(name: string, extraEnv: Record<string, string> = {}): ChildProcess {
  const child = spawn(process.execPath, ["--import", "tsx", "workers/main.ts"], {
    env: { ...process.env, NODE_ENV: "production", WORKER_NAME: name, WORKER_MAINTENANCE_INTERVAL_SECONDS: "1", WORKER_FIT_CONCURRENCY: "1", ...extraEnv },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stderr?.on("data", (chunk: Buffer) => process.stderr.write(`[${name}] ${chunk.toString()}`));
  if (process.env.TEST_SERVER_LOGS === "1") child.stdout?.on("data", (chunk: Buffer) => process.stderr.write(`[${name}] ${chunk.toString()}`));
  return child;
}

/** Resolves once the worker has printed that it listens. */
export function workerReady(child: ChildProcess): Promise<void> {
  return new Promise((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      if (chunk.toString().includes("listening")) {
        child.stdout?.off("data", onData);
        resolve();
      }
    };
    child.stdout?.on("data", onData);
    child.once("exit", (code) => reject(new Error(`worker exited early with ${code}`)));
  });
}

/** Stops a worker of the test's own and waits for it to exit. */
export function stopWorker(child: ChildProcess, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once("exit", () => resolve());
    child.kill(signal);
  });
}

/**
 * Writes revision `number` of a fit as if a worker had claimed it and then vanished: status running,
 * `attempts` runs so far, a runner that no longer exists and a heartbeat `heartbeatAgeSeconds` old (no
 * job in the queue). Returns the revision's id.
 */
export async function insertAbandonedRevision(params: {
  fitId: string;
  number: number;
  inputs: unknown;
  attempts: number;
  heartbeatAgeSeconds: number;
  cancelRequested?: boolean;
}): Promise<string> {
  const id = randomUUID();
  await db.insert(fitRevision).values({
    id,
    fitId: params.fitId,
    number: params.number,
    inputs: params.inputs,
    status: "running",
    attempts: params.attempts,
    runner: "vanished-worker:1",
    startedAt: sql`now() - make_interval(secs => ${params.heartbeatAgeSeconds + 1})`,
    heartbeatAt: sql`now() - make_interval(secs => ${params.heartbeatAgeSeconds})`,
    cancelRequested: params.cancelRequested ? sql`now()` : null,
    progress: { start: 0, starts: 1, iteration: 3, chiSquared: 1, elapsedMs: 900, updatedAt: new Date().toISOString() },
  });
  return id;
}
