import { mkdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { chromium, type Browser, type Page } from "playwright-core";
import { inject } from "vitest";

/** Folder for screenshots (git-ignored); look at them after a run. */
export const screenshotDir = fileURLToPath(new URL("./screenshots/", import.meta.url));

/**
 * The app under test, started by the browser project's global setup (tests/support/global-setup.ts).
 * Read through inject(): inside test files vitest sets process.env.BASE_URL to Vite's own base ("/").
 */
export function baseUrl(): string {
  const url = inject("baseUrl");
  if (!url) throw new Error("No baseUrl was provided; run the browser suite through `npm test`.");
  return url.replace(/\/$/, "");
}

/** Debian's chromium with the flags STACK.md lists for headless runs as root. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/** A fresh page (own cookies) that records console errors, uncaught page errors and failed requests. */
export async function newIsolatedPage(browser: Browser, problems: string[]): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 }, baseURL: baseUrl() });
  const page = await context.newPage();
  page.on("console", (message) => {
    if (message.type() === "error") {
      problems.push(`console: ${message.text()} (${message.location().url})`);
    }
  });
  page.on("pageerror", (error) => problems.push(`page error: ${error.message}`));
  page.on("response", (response) => {
    if (response.status() >= 400) {
      problems.push(`HTTP ${response.status()}: ${response.url()}`);
    }
  });
  return page;
}

/** Saves a full-page screenshot under {@link screenshotDir}. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: `${screenshotDir}${name}.png`, fullPage: true });
}
