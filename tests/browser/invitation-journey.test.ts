import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchChromium, newIsolatedPage, screenshot } from "./browser-session";

// One run's people and workspace (invented names; unique addresses per run so reruns do not collide).
const runId = Date.now().toString(36);
const owner = { name: "Owner Tester", email: `owner-${runId}@halvorsen-lab.test`, password: "kagome-bands-owner-1" };
const colleague = { name: "Viewer Tester", email: `viewer-${runId}@halvorsen-lab.test`, password: "kagome-bands-viewer-1" };
const workspaceName = `Kagome ARPES ${runId}`;

let browser: Browser;
const problems: string[] = [];

beforeAll(async () => {
  browser = await launchChromium();
});

afterAll(async () => {
  await browser?.close();
});

async function signUp(page: Page, person: typeof owner) {
  await page.getByLabel("Your name").fill(person.name);
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByRole("button", { name: "Create account" }).click();
}

/**
 * The invitation link for `email` from the development mail page, reloading until it has arrived. The
 * page must be signed in as `email`: /dev/mail shows each user only their own mail.
 */
async function invitationLinkFromMailPage(page: Page, email: string): Promise<string> {
  const link = page.locator("article", { hasText: email }).locator('a[href*="/invitations/"]').first();
  for (let attempt = 0; attempt < 20; attempt += 1) {
    await page.goto("/dev/mail");
    if ((await link.count()) > 0) {
      const href = await link.getAttribute("href");
      if (href) return href;
    }
    await page.waitForTimeout(500);
  }
  throw new Error(`No invitation e-mail for ${email} reached the mail sink`);
}

describe("sign-up, workspace, invitation and viewer access in the browser", () => {
  let workspacePath = "";

  it("shows the landing page with a way to sign up and sign in", async () => {
    const page = await newIsolatedPage(browser, problems);
    await page.goto("/");
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toMatch(/Tight-binding models/);
    expect(await page.getByRole("link", { name: "Create an account" }).count()).toBe(1);
    expect(await page.getByRole("link", { name: "Sign in" }).count()).toBeGreaterThan(0);
    await screenshot(page, "01-landing");

    // Keyboard users land on the skip link first, then move through the page with a visible focus ring.
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Skip to content");
    await page.keyboard.press("Tab");
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Create an account");
    await screenshot(page, "01b-landing-keyboard-focus");
    await page.context().close();
  });

  it("lets a new user sign up, create a workspace and invite a colleague as viewer", async () => {
    const page = await newIsolatedPage(browser, problems);
    await page.goto("/");
    await page.getByRole("link", { name: "Create an account" }).click();
    await page.waitForURL("**/sign-up");
    await page.getByRole("heading", { name: "Create your account" }).waitFor();
    await screenshot(page, "02-sign-up");
    await signUp(page, owner);
    await page.waitForURL("**/workspaces");
    await page.getByText("You are not in a workspace yet").waitFor();
    await screenshot(page, "03-workspaces-empty");

    await page.getByLabel("Workspace name").fill(workspaceName);
    await page.getByRole("button", { name: "Create workspace" }).click();
    await page.waitForURL(/\/w\/[a-z0-9-]+$/);
    workspacePath = new URL(page.url()).pathname;
    await page.getByText("No datasets yet").waitFor();
    expect(await page.getByRole("link", { name: "Upload a dataset" }).getAttribute("href")).toBe(`${workspacePath}/datasets/new`);
    expect(await page.getByRole("link", { name: "Start a fit" }).getAttribute("href")).toBe(`${workspacePath}/fits`);
    await screenshot(page, "04-workspace-home-owner");

    await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Members" }).click();
    await page.waitForURL(`**${workspacePath}/members`);
    const inviteForm = page.getByRole("form", { name: "Invite a member" });
    await inviteForm.getByLabel("E-mail").fill(colleague.email);
    await inviteForm.getByLabel("Role").selectOption("viewer");
    await inviteForm.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${colleague.email}.`).waitFor();
    await page.getByRole("cell", { name: colleague.email, exact: true }).waitFor();
    await screenshot(page, "05-members-owner");
    await page.context().close();
  });

  it("lets the colleague sign up from the development mail page, follow the e-mailed link, accept, and see the workspace read-only", async () => {
    expect(workspacePath).not.toBe("");
    const page = await newIsolatedPage(browser, problems);
    // Signed out, /dev/mail first asks who is reading: it shows each user only the mail sent to them.
    await page.goto("/dev/mail");
    await page.waitForURL(/\/sign-in\?next=%2Fdev%2Fmail$/);
    await page.getByRole("link", { name: "Create an account" }).click();
    await page.waitForURL(/\/sign-up\?next=%2Fdev%2Fmail$/);
    await signUp(page, colleague);
    await page.waitForURL(/\/dev\/mail$/);
    const invitationUrl = await invitationLinkFromMailPage(page, colleague.email);
    expect(await page.getByRole("article").count()).toBe(1);
    await screenshot(page, "06-dev-mail");

    // The same link opened signed out says nothing about the workspace and offers a way back to it.
    const signedOut = await newIsolatedPage(browser, problems);
    await signedOut.goto(invitationUrl);
    await signedOut.getByRole("heading", { name: "You have been invited to a Bandwright workspace" }).waitFor();
    expect(await signedOut.getByText(workspaceName).count()).toBe(0);
    expect(await signedOut.getByRole("link", { name: "Create an account" }).getAttribute("href")).toMatch(/^\/sign-up\?next=%2Finvitations%2F/);
    await screenshot(signedOut, "07-invitation-signed-out");
    await signedOut.context().close();

    await page.goto(invitationUrl);
    await page.getByRole("heading", { name: `Join ${workspaceName}` }).waitFor();
    await screenshot(page, "08-invitation-accept");
    await page.getByRole("button", { name: "Accept and open the workspace" }).click();
    await page.waitForURL(`**${workspacePath}`);
    await page.getByText("No datasets yet").waitFor();

    await page.goto(`${workspacePath}/members`);
    await page.getByRole("cell", { name: owner.email }).waitFor();
    const viewerRow = page.getByRole("row", { name: new RegExp(colleague.email.replace(/[.+]/g, "\\$&")) });
    expect(await viewerRow.getByText("Viewer", { exact: true }).count()).toBe(1);
    // Viewers see the list but none of the owner's controls.
    expect(await page.getByRole("form", { name: "Invite a member" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /Remove/ }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /Save/ }).count()).toBe(0);
    await screenshot(page, "09-members-viewer");
    await page.context().close();
  });

  it("lets the owner sign in again, promote the colleague to editor and then remove them", async () => {
    const page = await newIsolatedPage(browser, problems);
    await page.goto(`${workspacePath}/members`);
    // Signed out: the guard sends the owner to sign in and back to the members page.
    await page.waitForURL("**/sign-in?next=*");
    await page.getByLabel("E-mail").fill(owner.email);
    await page.getByLabel("Password").fill(owner.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`**${workspacePath}/members`);

    const colleagueRow = page.getByRole("row", { name: new RegExp(colleague.email.replace(/[.+]/g, "\\$&")) });
    await colleagueRow.getByLabel(`Role of ${colleague.name}`).selectOption("editor");
    await colleagueRow.getByRole("button", { name: `Save role of ${colleague.name}` }).click();
    // The role column (third cell) shows the badge; the row's select also lists every role, so read the cell.
    await expect.poll(() => colleagueRow.getByRole("cell").nth(2).textContent(), { timeout: 10_000 }).toBe("Editor");
    await screenshot(page, "10-members-owner-after-role-change");

    page.once("dialog", (dialog) => void dialog.accept());
    await colleagueRow.getByRole("button", { name: `Remove ${colleague.name}` }).click();
    await page.getByRole("cell", { name: colleague.email, exact: true }).waitFor({ state: "detached" });
    expect(await page.getByRole("cell", { name: owner.email }).count()).toBe(1);
    await page.context().close();
  });

  it("raised no console or page errors along the way", () => {
    expect(problems).toEqual([]);
  });
});
