import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertLegacyRevision } from "@/tests/integration/fits/helpers";
import { testPassword } from "@/tests/support/client";
import { type Team, createTeam } from "@/tests/support/workspace";
import { launchChromium, newIsolatedPage, screenshot } from "./browser-session";

// A revision stored before bond integrals were spelled V_ppπ[Si–Si,1] (issue 11, item 14; its names read
// V_pp_pi[Si-Si,1]): its page shows today's typeset names, and "New revision from this one" pre-fills the
// form with them and launches a revision that runs.

async function signIn(page: Page, email: string, next: string) {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(testPassword);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`**${next}`);
}

describe("a revision stored in the earlier spelling, in the browser", () => {
  let browser: Browser;
  let team: Team;
  let fitId = "";
  let editorEmail = "";
  const problems: string[] = [];

  beforeAll(async () => {
    team = await createTeam("Halvorsen Quantum Materials Lab");
    fitId = await insertLegacyRevision(team);
    editorEmail = ((await team.editor.get("/api/auth/get-session")).body as { user: { email: string } }).user.email;
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("shows its page with typeset names, and a new revision from it runs", async () => {
    const page = await newIsolatedPage(browser, problems);
    const revisionPath = `/w/${team.slug}/fits/${fitId}/revisions/1`;
    await signIn(page, editorEmail, revisionPath);
    const parameters = page.getByRole("table", { name: /^Parameters: fitted value/ });
    await expect.poll(() => parameters.getByRole("row").count(), { timeout: 20_000 }).toBeGreaterThan(10);
    const ppPi = parameters.getByRole("row").filter({ hasText: "V(ppπ) Si–Si, shell 1" });
    expect(await ppPi.count()).toBe(1);
    expect(await ppPi.textContent()).toContain("V_ppπ[Si–Si,1]");
    expect(await page.getByText("V_pp_pi").count()).toBe(0);
    expect(await page.getByText("not treated (fitted before band crossings were)").count()).toBe(1);
    await screenshot(page, "legacy-revision");

    await page.getByRole("link", { name: "New revision from this one" }).click();
    await page.waitForURL("**/revisions/new?from=1");
    const start = page.getByLabel("V(ppπ) Si–Si, shell 1 start value");
    await expect.poll(() => start.count(), { timeout: 20_000 }).toBe(1);
    expect(Number(await start.inputValue())).toBeLessThan(0); // the fitted ppπ, from the old-spelling result
    await page.getByLabel("Iterations per start").fill("20");
    await page.getByRole("button", { name: "Launch revision" }).click();
    await page.waitForURL(`**/fits/${fitId}/revisions/2`);
    await expect.poll(() => page.getByTestId("revision-status").textContent(), { timeout: 30_000 }).toBe("finished");
    await screenshot(page, "legacy-revision-2");
    expect(problems).toEqual([]);
  });
});
