import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { TestClient, testEmail, testPassword } from "@/tests/support/client";
import { linkIn, waitForMail } from "@/tests/support/mail";
import { baseUrl, launchChromium, newIsolatedPage, screenshot } from "./browser-session";

// Issue 7 browser check: an editor drops a fixture file, maps its columns, sees the chart and the table;
// a bad file shows its row and column errors in the form. Screenshots: tests/browser/screenshots/ds-*.png.

const fixture = fileURLToPath(new URL("../../fixtures/hq12-photoemission-cuts.csv", import.meta.url));
const editorEmail = testEmail("ds-editor");

let browser: Browser;
let page: Page;
let slug = "";
const problems: string[] = [];

/** Signs the editor up in the browser context, and has an owner (API) invite them; they accept in the browser. */
async function editorInWorkspace(): Promise<void> {
  const origin = { origin: baseUrl() };
  const signedUp = await page.request.post("/api/auth/sign-up/email", { data: { name: "Ingrid Editor", email: editorEmail, password: testPassword }, headers: origin });
  expect(signedUp.status()).toBe(200);
  const owner = new TestClient();
  await owner.newUser("ds-owner");
  const created = await owner.post("/api/workspaces", { name: "HQ ARPES bench" });
  slug = (created.body as { slug: string }).slug;
  expect((await owner.post(`/api/workspaces/${slug}/invitations`, { email: editorEmail, role: "editor" })).status).toBe(201);
  const link = linkIn(await waitForMail(editorEmail), `${baseUrl()}/invitations/`);
  const invitationId = decodeURIComponent(link.split("/invitations/")[1]);
  const accepted = await page.request.post("/api/auth/organization/accept-invitation", { data: { invitationId }, headers: origin });
  expect(accepted.status()).toBe(200);
}

beforeAll(async () => {
  browser = await launchChromium();
  page = await newIsolatedPage(browser, problems);
  await editorInWorkspace();
});

afterAll(async () => {
  await browser?.close();
});

describe("dataset upload in the browser", () => {
  it("starts from the empty list and reaches the upload form", async () => {
    await page.goto(`/w/${slug}/datasets`);
    await page.getByText("No datasets yet").waitFor();
    await screenshot(page, "ds-01-empty-list");
    await page.getByRole("link", { name: "Upload a band file" }).click();
    await page.getByRole("heading", { name: "Upload a dataset" }).waitFor();
  });

  it("previews a dropped photoemission file with guessed roles, uploads it and shows chart and table", async () => {
    await page.setInputFiles('input[type="file"]', fixture);
    await page.getByRole("heading", { name: "Columns" }).waitFor();
    // Guesses from the header (lib/datasets guessColumnRoles): E (meV) → energy in meV, dE (meV) → σ, cut → label,
    // branch → band (the file has no band column).
    expect(await page.getByLabel("E (meV)", { exact: true }).inputValue()).toBe("energy");
    expect(await page.getByLabel("dE (meV)", { exact: true }).inputValue()).toBe("sigma");
    expect(await page.getByLabel("cut", { exact: true }).inputValue()).toBe("label");
    expect(await page.getByLabel("branch", { exact: true }).inputValue()).toBe("band");
    expect(await page.getByLabel("Energy unit").inputValue()).toBe("meV");
    await page.getByLabel("Source").selectOption("photoemission");
    await page.getByLabel("Name", { exact: true }).fill("HQ-12 cuts through K");
    await page.getByLabel(/Energy reference/).fill("Fermi level");
    await screenshot(page, "ds-02-mapping-form");
    await page.getByRole("button", { name: "Upload dataset" }).click();

    await page.waitForURL(/\/datasets\/[0-9a-f-]{36}$/);
    await page.getByRole("heading", { name: "HQ-12 cuts through K" }).waitFor();
    await page.locator("figure[role=img] svg .recharts-scatter-symbol").first().waitFor();
    expect(await page.locator("figure[role=img] .recharts-scatter").count()).toBe(2);
    expect(await page.getByText(/points · page 1 of/).textContent()).toMatch(/^103 points/);
    expect(await page.locator("tbody tr").count()).toBe(50);
    await screenshot(page, "ds-03-dataset-page");

    // A first click on a numeric column sorts descending (TanStack Table's default for numbers).
    await page.getByRole("button", { name: "Energy" }).click();
    await page.waitForURL(/sort=-energy/);
    await page.getByLabel("Band", { exact: true }).selectOption("2");
    await page.waitForURL(/band=2/);
    await page.getByRole("columnheader", { name: /Energy/ }).and(page.locator('[aria-sort="descending"]')).waitFor();
    const energies = await page.locator("tbody tr td:nth-child(6)").allTextContents();
    const values = energies.map((e) => Number(e.replace("\u2212", "-").replace(" eV", "")));
    expect(values).toEqual([...values].sort((a, b) => b - a));
    expect(await page.locator("tbody tr td:nth-child(3)").allTextContents()).toEqual(values.map(() => "2"));
    await screenshot(page, "ds-04-points-sorted-band-2");
  });

  it("shows the server's row and column errors in the form for a bad file, storing nothing", async () => {
    await page.goto(`/w/${slug}/datasets/new`);
    // A typo in the energy (column 5) of line 7, the file's second data row.
    const lines = readFileSync(fixture, "utf8").split("\n");
    const fields = lines[6].split(",");
    fields[4] = fields[4].replace(/^(-?\d)/, "$1x");
    lines[6] = fields.join(",");
    const bad = lines.join("\n");
    await page.setInputFiles('input[type="file"]', { name: "hq12-with-a-typo.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("heading", { name: "Columns" }).waitFor();
    await page.getByRole("button", { name: "Upload dataset" }).click();
    const list = page.getByRole("list", { name: "Problems in the file" });
    await list.waitFor();
    // Line 7 of the file (5 comment/header lines, then the second data row); column 5 is "E (meV)".
    expect(await list.textContent()).toMatch(/Row 7, column 5 \(E \(meV\)\)/);
    await screenshot(page, "ds-05-refused-file");
    await page.goto(`/w/${slug}/datasets`);
    expect(await page.locator("tbody tr").count()).toBe(1);
  });

  it("saw no unexpected errors (the refused upload's 422 is expected)", () => {
    const unexpected = problems.filter((p) => !/422/.test(p) && !/status of 422/.test(p));
    expect(unexpected).toEqual([]);
  });
});
