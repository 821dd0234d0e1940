import { execFile } from "node:child_process";
import { readFileSync } from "node:fs";
import { promisify } from "node:util";
import AxeBuilder from "@axe-core/playwright";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pngPixelSize } from "@/lib/views/figure";
import { type UploadTeam, createUploadTeam, fixtureBytes, fixtureMappings, upload } from "@/tests/integration/datasets/helpers";
import { waitForRevision, isFinal } from "@/tests/integration/fits/helpers";
import { TestClient, testPassword } from "@/tests/support/client";
import { baseUrl, launchChromium, newIsolatedPage, screenshot } from "./browser-session";

// Issue 18 (API keys in the browser, figures, error bars) and issue 13 item 8 (charts), walked in the
// browser: a key made on the API keys page is read once, used with curl, revoked; the revision page's
// figures download at their print sizes; σ shows as error bars; axe finds nothing serious.

const DFT = "hq07-honeycomb-monolayer-dft.csv";
const PEAKS = "hq12-photoemission-cuts.csv";
const run = promisify(execFile);

/** curl, as a notebook's script would call the API: the HTTP status and the body. */
async function curl(url: string, key: string): Promise<{ status: number; body: string }> {
  const { stdout } = await run("curl", ["-s", "-H", `Authorization: Bearer ${key}`, "-w", "\n%{http_code}", url]);
  const cut = stdout.lastIndexOf("\n");
  return { status: Number(stdout.slice(cut + 1)), body: stdout.slice(0, cut) };
}

async function signIn(page: Page, email: string, next: string) {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(testPassword);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`**${next}`);
}

/** axe (WCAG 2.x A/AA rules) on the page as it is: no serious or critical finding. */
async function expectNoSeriousAxeFindings(page: Page, where: string) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"]).analyze();
  const serious = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(serious.map((v) => `${where}: ${v.id} (${v.nodes.length}) ${v.nodes[0]?.target.join(" ")}`)).toEqual([]);
}

/** At 390 px (a phone) the page is no wider than the screen; saves a screenshot first. */
async function expectFitsPhone(page: Page, where: string, shot: string) {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.waitForTimeout(300);
  await screenshot(page, shot);
  const { width, wide } = await page.evaluate(() => ({
    width: document.documentElement.scrollWidth,
    // the outermost elements that reach past the screen, to name the culprit in the message
    wide: [...document.querySelectorAll("body *")]
      .filter((e) => e.getBoundingClientRect().right > 391 && !(e.parentElement && e.parentElement.getBoundingClientRect().right > 391))
      .slice(0, 5)
      .map((e) => `${e.tagName.toLowerCase()}.${[...e.classList].slice(0, 4).join(".")}`),
  }));
  expect(width, `${where} is ${width} px wide at 390 px: ${wide.join(", ")}`).toBeLessThanOrEqual(390);
}

describe("scripts and papers in the browser", () => {
  let browser: Browser;
  let team: UploadTeam;
  let editorEmail = "";
  let revisionPath = "";
  let peaksId = "";
  const problems: string[] = [];

  beforeAll(async () => {
    team = await createUploadTeam("Halvorsen Quantum Materials Lab");
    const dft = await upload(team, { name: DFT, bytes: fixtureBytes(DFT) }, fixtureMappings[DFT]);
    expect(dft.status).toBe(201);
    const peaks = await upload(team, { name: PEAKS, bytes: fixtureBytes(PEAKS) }, fixtureMappings[PEAKS]);
    expect(peaks.status).toBe(201);
    peaksId = (peaks.body as { id: string }).id;
    const editor = TestClient.withApiKey(team.editorKey);
    const launched = await editor.post(`/api/workspaces/${team.slug}/fits`, {
      datasetId: (dft.body as { id: string }).id,
      name: "HQ-07 π bands",
      model: { template: "honeycomb-pz", latticeConstant: 2.4596 },
      options: { starts: 2, maxIterations: 60 },
    });
    expect(launched.status, JSON.stringify(launched.body)).toBe(201);
    const fitId = (launched.body as { fitId: string }).fitId;
    const finished = await waitForRevision(editor, `/api/workspaces/${team.slug}/fits/${fitId}/revisions/1`, isFinal, 60_000);
    expect(finished.status).toBe("succeeded");
    revisionPath = `/w/${team.slug}/fits/${fitId}/revisions/1`;
    const members = (await team.owner.get(`/api/workspaces/${team.slug}/members`)).body as { members: { email: string; role: string }[] };
    editorEmail = members.members.find((m) => m.role === "editor")!.email;
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("creates a key, shows it once, curl lists datasets with it, and after revoking curl gets 401", async () => {
    const page = await newIsolatedPage(browser, problems);
    const keysPath = `/w/${team.slug}/settings/api-keys`;
    await signIn(page, editorEmail, keysPath);
    await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "API keys" }).waitFor();
    // An editor may make editor or viewer keys, not owner keys.
    const roles = await page.getByLabel("Role").locator("option").evaluateAll((options) => options.map((o) => (o as HTMLOptionElement).value));
    expect(roles).toEqual(["editor", "viewer"]);
    await page.getByLabel("Name").fill("band-fits notebook");
    await page.getByLabel("Role").selectOption("viewer");
    await page.getByRole("button", { name: "Create key" }).click();
    const shown = page.getByLabel("The new API key");
    await shown.waitFor();
    const key = await shown.inputValue();
    expect(key).toMatch(/^bw_[A-Za-z0-9_-]{43}$/);
    const row = page.getByRole("row", { name: /band-fits notebook/ });
    await row.waitFor();
    expect(await row.textContent()).toContain(key.slice(0, 9));
    expect(await row.textContent()).toContain("never");
    await screenshot(page, "papers-01-api-key-created");
    await expectNoSeriousAxeFindings(page, "API keys page");

    const datasetsUrl = `${baseUrl()}/api/workspaces/${team.slug}/datasets`;
    const listed = await curl(datasetsUrl, key);
    expect(listed.status).toBe(200);
    const names = (JSON.parse(listed.body) as { datasets: { name: string }[] }).datasets.map((d) => d.name);
    expect(names).toEqual(expect.arrayContaining([fixtureMappings[DFT].name, fixtureMappings[PEAKS].name]));
    // A viewer key may read but not launch.
    const { stdout } = await run("curl", ["-s", "-o", "/dev/null", "-w", "%{http_code}", "-X", "POST", "-H", `Authorization: Bearer ${key}`, "-H", "content-type: application/json", "-d", "{}", `${baseUrl()}/api/workspaces/${team.slug}/fits`]);
    expect(stdout).toBe("403");

    // Once "Done" is pressed the key's text is gone from the page; the list keeps only its beginning.
    await page.getByRole("button", { name: "Done" }).click();
    await page.reload();
    expect(await page.content()).not.toContain(key);
    expect(await page.getByRole("row", { name: /band-fits notebook/ }).textContent()).not.toContain("never");

    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "Revoke the key band-fits notebook" }).click();
    await page.getByRole("row", { name: /band-fits notebook/ }).waitFor({ state: "detached" });
    expect((await curl(datasetsUrl, key)).status).toBe(401);
    await screenshot(page, "papers-02-api-key-revoked");
    await expectFitsPhone(page, "API keys page", "papers-03-api-keys-phone");
    await expectNoSeriousAxeFindings(page, "API keys page at 390 px");
    await page.context().close();
  });

  it("downloads the revision's figures at print size and passes axe", async () => {
    const page = await newIsolatedPage(browser, problems);
    await signIn(page, editorEmail, revisionPath);
    await page.getByRole("img", { name: /Band energies of HQ-07/ }).waitFor();
    await page.getByRole("img", { name: /Residual \(model − data\)/ }).waitFor();

    // PNG, double column: 17.8 cm at 300 dpi = 17.8 / 2.54 × 300 = 2102 px wide; 5 cm high → 591 px.
    await page.locator("#figure-kind").selectOption("residual");
    await page.locator("#figure-width").selectOption("double");
    const [png] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Figure (PNG, 300 dpi)" }).click()]);
    expect(png.suggestedFilename()).toBe("hq-07-bands-r1-residuals-double-column.png");
    const pngBytes = new Uint8Array(readFileSync((await png.path())!));
    expect(pngPixelSize(pngBytes)).toEqual({ width: 2102, height: 591 });

    // PNG, single column overlay: 8.6 cm → 1016 px; 6.5 cm → 768 px.
    await page.locator("#figure-kind").selectOption("overlay");
    await page.locator("#figure-width").selectOption("single");
    const [overlayPng] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Figure (PNG, 300 dpi)" }).click()]);
    const overlayBytes = new Uint8Array(readFileSync((await overlayPng.path())!));
    expect(pngPixelSize(overlayBytes)).toEqual({ width: 1016, height: 768 });

    const [svg] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Figure (SVG)" }).click()]);
    const svgText = readFileSync((await svg.path())!, "utf8");
    expect(svgText).toContain('width="8.6cm"');
    expect(svgText).toContain("data:font/woff2;base64,");
    expect(svgText).toMatch(/>Γ</);
    expect(svgText).toContain("k along the path (1/Å)");

    // Look at the PNG itself: opened as an image in the browser.
    const pngPage = await browser.newPage();
    await pngPage.setContent(`<img alt="figure" src="data:image/png;base64,${Buffer.from(overlayBytes).toString("base64")}">`);
    await pngPage.screenshot({ path: new URL("./screenshots/papers-04-figure-overlay-single.png", import.meta.url).pathname, fullPage: true });
    await pngPage.close();

    await screenshot(page, "papers-05-revision");
    await expectNoSeriousAxeFindings(page, "revision page");
    await expectFitsPhone(page, "revision page", "papers-06-revision-phone");
    await expectNoSeriousAxeFindings(page, "revision page at 390 px");
    await page.context().close();
  });

  it("draws σ as error bars on photoemission data in the launch preview", async () => {
    const page = await newIsolatedPage(browser, problems);
    await signIn(page, editorEmail, `/w/${team.slug}/fits/new`);
    await page.getByLabel("Dataset").selectOption(peaksId);
    await page.getByRole("img", { name: /Band energies of HQ-12/ }).waitFor();
    await expect.poll(() => page.locator(".recharts-errorBar").count()).toBeGreaterThan(0);
    await page.getByText("Dots: data with ±σ bars").waitFor();
    await screenshot(page, "papers-07-launch-preview-error-bars");
    await expectNoSeriousAxeFindings(page, "launch form");
    await page.context().close();
  });

  it("had no console errors, page errors or failed requests", () => {
    expect(problems).toEqual([]);
  });
});
