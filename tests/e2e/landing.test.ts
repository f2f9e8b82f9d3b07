import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { baseUrl, screenshot, sharedBrowser, watchPage } from "../support/browser";

const browser = sharedBrowser();

describe("landing page in Chromium", () => {
  it("says what Ampwright is for, links every area, and loads cleanly on a shop monitor", async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 900 } });
    const watch = watchPage(page);
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    await expect(page.getByTestId("landing-title").textContent()).resolves.toContain("Prove where the fault is");
    for (const label of ["Jobs", "Circuits", "Diagnosis", "Sizing", "Lessons"]) {
      await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: label }).count()).resolves.toBe(1);
    }
    await expect(page.getByTestId("safety-note").textContent()).resolves.toContain("hydrogen");
    // The shipped typeface is the one in use (no fallback, nothing fetched from elsewhere).
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(family).toMatch(/public/i);
    const file = await screenshot(page, "landing-1440");
    expect(fs.statSync(file).size).toBeGreaterThan(10_000);
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it("fits a phone held at the vehicle without sideways scrolling", async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2 });
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "landing-390");
    await page.close();
  });

  it("opens an area from the navigation, marking it as the current page", async () => {
    const page = await browser().newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Sizing" }).click();
    await page.waitForURL(/\/size$/);
    await expect(page.getByRole("link", { name: "Sizing" }).getAttribute("aria-current")).resolves.toBe("page");
    // An area that needs an account sends a visitor to sign in, and back there after.
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Diagnosis" }).click();
    await page.waitForURL(/\/sign-in\?next=%2Fdiagnosis$/);
    await page.close();
  });

  it("answers an unknown address with Ampwright's 404 page", async () => {
    const page = await browser().newPage();
    const res = await page.goto(`${baseUrl}/does-not-exist`);
    expect(res?.status()).toBe(404);
    await expect(page.getByTestId("not-found").textContent()).resolves.toContain("nothing at this address");
    await screenshot(page, "not-found");
    await page.close();
  });

  it("reports the database as up on /api/health", async () => {
    const res = await fetch(`${baseUrl}/api/health`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { status: string; database: { status: string } };
    expect(body.database.status).toBe("up");
  });
});
