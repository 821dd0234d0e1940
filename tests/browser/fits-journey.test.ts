import { readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testPassword } from "@/tests/support/client";
import { type UploadTeam, createUploadTeam, fixtureBytes, fixtureMappings, upload } from "@/tests/integration/datasets/helpers";
import { launchChromium, newIsolatedPage, screenshot } from "./browser-session";

// The honeycomb fixture (fixtures/parameters.json): two pz bands from t1 = 2.62 eV, t2 = 0.11 eV,
// t3 = 0.05 eV with 4 meV noise, made by scripts/make-fixtures.ts from the honeycomb-pz template.
const FIXTURE = "hq07-honeycomb-monolayer-dft.csv";
// The silicon-like sp3s* fixture (10 bands): slow enough with many starts to watch the progress bar.
const SLOW_FIXTURE = "hq-s3-silicon-like-sp3s-star.tsv";

async function signIn(page: Page, email: string, next: string) {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(testPassword);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`**${next}`);
}

describe("fit views in the browser", () => {
  let browser: Browser;
  let team: UploadTeam;
  let emails: { editor: string; viewer: string };
  let revisionPath = "";
  let slowDatasetId = "";
  let datasetId = "";
  const problems: string[] = [];

  beforeAll(async () => {
    team = await createUploadTeam("Halvorsen Quantum Materials Lab");
    const uploaded = await upload(team, { name: FIXTURE, bytes: fixtureBytes(FIXTURE) }, fixtureMappings[FIXTURE]);
    expect(uploaded.status).toBe(201);
    datasetId = (uploaded.body as { id: string }).id;
    const slow = await upload(team, { name: SLOW_FIXTURE, bytes: fixtureBytes(SLOW_FIXTURE), type: "text/tab-separated-values" }, fixtureMappings[SLOW_FIXTURE]);
    expect(slow.status).toBe(201);
    slowDatasetId = (slow.body as { id: string }).id;
    const members = (await team.owner.get(`/api/workspaces/${team.slug}/members`)).body as { members: { email: string; role: string }[] };
    emails = {
      editor: members.members.find((m) => m.role === "editor")!.email,
      viewer: members.members.find((m) => m.role === "viewer")!.email,
    };
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("refuses bad values beside their fields and sends nothing", async () => {
    const page = await newIsolatedPage(browser, problems);
    await signIn(page, emails.editor, `/w/${team.slug}/fits/new`);
    let posts = 0;
    page.on("request", (r) => void (r.method() === "POST" && r.url().endsWith(`/api/workspaces/${team.slug}/fits`) && posts++));

    await page.getByLabel("Fit name").fill("bad values");
    await page.getByLabel("Dataset").selectOption({ index: 1 });
    await page.getByLabel("t1 start value").fill("abc");
    await page.getByLabel("t2 lower bound").fill("1");
    await page.getByLabel("t2 upper bound").fill("-1");
    await page.getByLabel("Window from (eV)").fill("2");
    await page.getByLabel("Window to (eV)").fill("2");
    await page.getByRole("button", { name: "Launch fit" }).click();

    await page.getByText("Nothing was sent").waitFor();
    // Each message sits beside its field and is tied to it with aria-describedby.
    const describedBy = async (label: string) => {
      const id = await page.getByLabel(label).getAttribute("aria-describedby");
      return id ? page.locator(`[id="${id.split(" ")[0]}"]`).textContent() : null;
    };
    expect(await describedBy("t1 start value")).toBe("enter a number, e.g. −2.5 or 1e-3");
    expect(await describedBy("t2 upper bound")).toBe("max must not be below min");
    expect(await describedBy("Window to (eV)")).toBe("the window's min must be below its max (eV)");
    expect(await page.getByLabel("t1 start value").getAttribute("aria-invalid")).toBe("true");
    await screenshot(page, "fits-01-form-errors");
    expect(posts).toBe(0);
    await page.context().close();
  });

  it("lets an editor launch, watch, inspect, sort, revise, compare and download", async () => {
    const page = await newIsolatedPage(browser, problems);
    await signIn(page, emails.editor, `/w/${team.slug}/fits`);
    await page.getByText("No fits yet").waitFor();
    await screenshot(page, "fits-02-empty-list");
    await page.getByRole("link", { name: "New fit" }).first().click();
    await page.waitForURL("**/fits/new");

    await page.getByLabel("Fit name").fill("HQ-07 π bands");
    await page.getByLabel("Dataset").selectOption(datasetId);
    // The preview draws the template's bands over the data before anything is sent.
    await page.getByRole("img", { name: /Band energies of HQ-07/ }).waitFor();
    await page.getByLabel("Lattice constant (Å)").fill("2.4596");
    // Start away from the fixture's values (t1 = 2.62 eV) so that the fit has work to do; free t2, t3 stays fixed.
    await page.getByLabel("t1 start value").fill("2.3");
    await page.getByLabel("fit t2").check();
    expect(await page.getByLabel("fit t3").isChecked()).toBe(false);
    await page.getByLabel("Iterations per start").fill("60");
    await screenshot(page, "fits-03-launch-form");
    await page.getByRole("button", { name: "Launch fit" }).click();

    await page.waitForURL(/\/fits\/[^/]+\/revisions\/1$/);
    revisionPath = new URL(page.url()).pathname;
    // Progress while it runs (the bar may already be gone on a fast machine), then the result.
    const status = page.getByTestId("revision-status");
    await expect.poll(() => status.textContent(), { timeout: 60_000 }).toBe("finished");
    await page.getByRole("img", { name: /Band energies of HQ-07/ }).waitFor();
    await page.getByRole("img", { name: /Residual \(model − data\)/ }).waitFor();
    await page.getByRole("table", { name: /Residuals per band/ }).waitFor();
    await screenshot(page, "fits-04-revision");

    // Sort the per-point table by |residual|, largest first: the server answers the sorted page.
    const residualTable = page.getByRole("table", { name: /Per-point residuals/ });
    const absHeader = residualTable.getByRole("columnheader", { name: /\|Residual\|/ });
    // |Residual| sorts largest first on the first click (the worst points are what one looks for).
    const descending = page.waitForResponse((r) => r.url().includes("/residuals?") && r.url().includes("sort=-absResidual"));
    await absHeader.getByRole("button").click();
    const page1 = (await (await descending).json()) as { rows: { residual: number }[] };
    const magnitudes = page1.rows.map((r) => Math.abs(r.residual));
    expect(magnitudes.length).toBeGreaterThan(1);
    expect(magnitudes).toEqual([...magnitudes].sort((a, b) => b - a));
    await expect.poll(() => absHeader.getAttribute("aria-sort")).toBe("descending");
    const firstCell = await residualTable.getByRole("row").nth(1).getByRole("cell").nth(7).textContent();
    expect(firstCell).toContain(Math.abs(page1.rows[0].residual).toFixed(4));
    await screenshot(page, "fits-05-residuals-sorted");

    // Download the JSON parameter set and check the file.
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Parameter set (JSON)" }).click()]);
    const exported = JSON.parse(readFileSync((await download.path())!, "utf8")) as { parameters: { name: string; value: number }[] };
    const t1 = exported.parameters.find((p) => p.name === "t1");
    expect(t1?.value).toBeCloseTo(2.62, 1); // fixture value, 4 meV noise (fixtures/parameters.json)

    // A second revision with t3 freed, from the first one's fitted values.
    await page.getByRole("link", { name: "New revision from this one" }).click();
    await page.waitForURL("**/revisions/new?from=1");
    // Pre-filled with revision 1's fitted values as start values.
    expect(Number(await page.getByLabel("t1 start value").inputValue())).toBeCloseTo(t1!.value, 9);
    await page.getByLabel("fit t3").check();
    await screenshot(page, "fits-06-new-revision-form");
    await page.getByRole("button", { name: "Launch revision" }).click();
    await page.waitForURL(/\/revisions\/2$/);
    await expect.poll(() => page.getByTestId("revision-status").textContent(), { timeout: 60_000 }).toBe("finished");

    // Compare the two.
    await page.getByRole("link", { name: "All revisions" }).click();
    await page.getByRole("button", { name: "Compare" }).click();
    await page.waitForURL(/\/compare\?a=1&b=2$/);
    const table = page.getByRole("table", { name: /Parameters of revision 1/ });
    await table.waitFor();
    expect(await table.getByRole("row", { name: /t3/ }).textContent()).toContain("freed in B");
    await page.getByRole("img", { name: /revision 1 and revision 2 as lines/ }).waitFor();
    await screenshot(page, "fits-07-compare");

    await page.context().close();
  });

  it("goes from a dataset to its fits and to a new fit on it; charts read the chart points in one request", async () => {
    expect(revisionPath).not.toBe("");
    const page = await newIsolatedPage(browser, problems);
    const pointRequests: string[] = [];
    page.on("request", (r) => void (/\/datasets\/[^/]+\/(chart-)?points\b/.test(r.url()) && pointRequests.push(new URL(r.url()).pathname.split("/").at(-1)!)));
    await signIn(page, emails.editor, `/w/${team.slug}/datasets/${datasetId}`);

    // The dataset's fits: name, dataset, latest revision with its status and RMS, who.
    await page.getByRole("link", { name: "Fits of this dataset" }).click();
    await page.waitForURL(`**/fits?dataset=${datasetId}`);
    const row = page.getByRole("row", { name: /HQ-07 π bands/ });
    await row.waitFor();
    const cells = await row.getByRole("cell").allTextContents();
    expect(cells[1]).toBe(fixtureMappings[FIXTURE].name);
    expect(cells.slice(2, 4)).toEqual(["2", "finished"]);
    expect(cells[4]).toMatch(/^0\.\d{4}\seV$/);
    expect(cells[5]).toMatch(/^Test editor/);
    expect(await page.getByRole("row", { name: /HQ-S3/ }).count()).toBe(0);
    await screenshot(page, "fits-10-dataset-fits");

    // The convergence trace starts at iteration 0, the start's χ²: the chart shows the whole drop.
    await page.goto(revisionPath);
    const trace = page.getByRole("img", { name: /^χ² fell from/ });
    await trace.waitFor();
    const [, from, to] = /fell from (\S+) to (\S+) in/.exec((await trace.getAttribute("aria-label"))!)!;
    expect(Number(from) / Number(to)).toBeGreaterThan(10);

    // The per-point table sorts by model energy on the server too.
    const residualTable = page.getByRole("table", { name: /Per-point residuals/ });
    const byModel = page.waitForResponse((r) => r.url().includes("/residuals?") && /sort=-?modelEnergy/.test(r.url()));
    const modelHeader = residualTable.getByRole("columnheader", { name: /Model E/ });
    await modelHeader.getByRole("button").click();
    const response = await byModel;
    // Numeric columns sort largest first on the first click (TanStack Table's default); the header says which.
    const descending = new URL(response.url()).searchParams.get("sort") === "-modelEnergy";
    const modelEnergies = ((await response.json()) as { rows: { modelEnergy: number }[] }).rows.map((r) => r.modelEnergy);
    expect(modelEnergies.length).toBeGreaterThan(1);
    expect(modelEnergies).toEqual([...modelEnergies].sort((a, b) => (descending ? b - a : a - b)));
    await expect.poll(() => modelHeader.getAttribute("aria-sort")).toBe(descending ? "descending" : "ascending");

    // A new fit on the dataset: the form opens with it chosen and previews it.
    await page.goto(`/w/${team.slug}/datasets/${datasetId}`);
    await page.getByRole("link", { name: "New fit on this dataset" }).click();
    await page.waitForURL(`**/fits/new?dataset=${datasetId}`);
    await page.getByRole("img", { name: /Band energies of HQ-07/ }).waitFor();
    // The select shows the dataset once the workspace's datasets have loaded.
    await expect.poll(() => page.getByLabel("Dataset").inputValue()).toBe(datasetId);
    await screenshot(page, "fits-11-new-fit-on-dataset");
    // The revision page and the preview each loaded the chart points once, never pages of points.
    expect(pointRequests).toEqual(["chart-points", "chart-points"]);
    await page.context().close();
  });

  it("shows a long fit's progress moving and cancels it", async () => {
    const page = await newIsolatedPage(browser, problems);
    await signIn(page, emails.editor, `/w/${team.slug}/fits/new`);
    await page.getByLabel("Fit name").fill("HQ-S3 many starts");
    await page.getByLabel("Dataset").selectOption(slowDatasetId);
    await page.getByLabel("Model template").selectOption("diamond-sp3s-star");
    await page.getByLabel("Starts", { exact: true }).fill("1000");
    await page.getByLabel("Time limit (s)").fill("300");
    await page.getByRole("button", { name: "Launch fit" }).click();
    await page.waitForURL(/\/revisions\/1$/);
    const bar = page.getByRole("progressbar", { name: "Fit progress" });
    await expect.poll(() => bar.getAttribute("aria-valuetext"), { timeout: 30_000 }).toMatch(/^iteration \d+, χ² /);
    const first = await page.getByText(/^Start \d+ of 1000/).textContent();
    await expect.poll(() => page.getByText(/^Start \d+ of 1000/).textContent(), { timeout: 30_000 }).not.toBe(first);
    await screenshot(page, "fits-08-progress");
    await page.getByRole("button", { name: "Cancel fit" }).click();
    await expect.poll(() => page.getByTestId("revision-status").textContent(), { timeout: 30_000 }).toBe("cancelled");
    await page.getByText("The fit was stopped; the results below are its best point so far.").waitFor();
    await page.getByRole("table", { name: /Residuals per band/ }).waitFor();
    await page.context().close();
  });

  it("shows a viewer the revision without launch, cancel or edit controls", async () => {
    expect(revisionPath).not.toBe("");
    const page = await newIsolatedPage(browser, problems);
    await signIn(page, emails.viewer, revisionPath);
    await page.getByRole("table", { name: /Residuals per band/ }).waitFor();
    expect(await page.getByRole("link", { name: "New revision from this one" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /Cancel/ }).count()).toBe(0);
    expect(await page.getByRole("link", { name: "Parameter set (JSON)" }).count()).toBe(1);
    await page.goto(`/w/${team.slug}/fits`);
    await page.getByRole("link", { name: "HQ-07 π bands" }).waitFor();
    expect(await page.getByRole("link", { name: "New fit" }).count()).toBe(0);
    await screenshot(page, "fits-09-viewer");
    await page.context().close();
    expect(problems).toEqual([]);
  });
});
