import fs from "node:fs";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { launchBrowser } from "./chromium";

export { launchBrowser };

export const baseUrl = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";
export const artifactsDir = path.resolve(process.env.E2E_ARTIFACTS ?? "test-artifacts");


export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(artifactsDir, { recursive: true });
  const file = path.join(artifactsDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Collects console errors and failed requests so a test can require a clean page. */
export function watchPage(page: Page): { problems: string[] } {
  const problems: string[] = [];
  page.on("console", (msg) => {
    if (msg.type() === "error") problems.push(`console: ${msg.text()}`);
  });
  page.on("pageerror", (err) => problems.push(`page error: ${err.message}`));
  page.on("response", (res) => {
    if (res.status() >= 400 && !res.url().includes("/does-not-exist")) problems.push(`${res.status()} ${res.url()}`);
  });
  return { problems };
}

/** One Chromium for a test file: launched before its tests, closed after them. */
export function sharedBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error("the browser is not running yet");
    return browser;
  };
}

/**
 * A browser context signed in once as a demo person, for the tests of a file to share: the sign-in abuse limit
 * (five a minute per address and account) is then never reached by the suite itself.
 */
export async function signedInContext(browser: Browser, email: string, password: string): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in?next=/account`, { waitUntil: "networkidle" });
  await page.getByTestId("sign-in-email").fill(email);
  await page.getByTestId("sign-in-password").fill(password);
  await page.getByTestId("sign-in-submit").click();
  await page.waitForURL((u) => u.pathname === "/account");
  await page.close();
  return context;
}
