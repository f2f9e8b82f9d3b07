import type { BrowserContext, Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/demo";
import { baseUrl, screenshot, sharedBrowser, signedInContext, watchPage } from "../support/browser";

const browser = sharedBrowser();
let priya: BrowserContext;
beforeAll(async () => {
  priya = await signedInContext(browser(), "priya@larkspur.example", DEMO_PASSWORD);
});

const step = (page: Page, title: string) => page.getByTestId("plan-step").filter({ hasText: title });

async function record(scope: ReturnType<Page["getByTestId"]>, volts: string) {
  await scope.getByTestId("plan-value").fill(volts);
  await scope.getByTestId("plan-save").click();
}

describe("the charging-system test plan in the browser", () => {
  it("follows the plan on the demo's Unit 27, reaches the ground-side verdict and shows the bracket on the canvas", async () => {
    const page = await priya.newPage();
    await page.setViewportSize({ width: 390, height: 844 }); // at the vehicle, on a phone
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/jobs/job_demo_unit27`, { waitUntil: "networkidle" });
    await page.getByTestId("circuit-link").click();
    await page.getByTestId("plan-link").click();
    await page.getByTestId("plan-heading").waitFor();
    expect(await page.getByTestId("plan-heading").textContent()).toBe("Charging system test plan");
    expect(await page.getByTestId("safety-note").textContent()).toContain("service information");

    // The resting battery was read before: 12.58 V, about 91 % by the BCI table, good.
    expect(await step(page, "Battery at rest").getAttribute("data-status")).toBe("good");
    // A bad entry gets a clear message and records nothing.
    await step(page, "B+ feed reaches the alternator").getByTestId("plan-save").click();
    expect(await step(page, "B+ feed reaches the alternator").getByRole("alert").textContent()).toContain("volts");

    // Readings the technician takes (invented for the demo story).
    await record(step(page, "B+ feed reaches the alternator"), "12.52");
    await expect.poll(() => step(page, "B+ feed reaches the alternator").getAttribute("data-status")).toBe("good");
    await record(step(page, "Positive side drop while charging"), "0.12");
    await expect.poll(() => step(page, "Positive side drop while charging").getAttribute("data-status")).toBe("good");
    await record(step(page, "Ground side drop while charging"), "1.10");
    await expect.poll(() => step(page, "Ground side drop while charging").getAttribute("data-status")).toBe("bad");
    await expect.poll(() => page.getByTestId("plan-verdict").getAttribute("data-verdict")).toBe("ground");

    // The whole side failed: measure across each part of it.
    const walk = page.getByTestId("plan-walk-part");
    expect(await walk.count()).toBe(3);
    await record(walk.filter({ hasText: "JBN:" }), "0.004");
    await expect.poll(() => walk.count()).toBe(2);
    await record(walk.filter({ hasText: "W6:" }), "0.02");
    await expect.poll(() => walk.count()).toBe(1);
    await record(walk.filter({ hasText: "JAC:" }), "1.05");
    await expect.poll(() => page.getByTestId("plan-verdict-title").textContent()).toContain("Alternator mounting bracket (JAC)");
    expect(await page.getByTestId("plan-verdict").getAttribute("data-verdict")).toBe("ground");
    await screenshot(page, "test-plan-verdict-390");
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);

    await page.setViewportSize({ width: 1440, height: 900 });
    await page.getByTestId("plan-show-suspect").click();
    await page.waitForURL(/\/workspace\?focus=JAC&state=charge&readings=1$/);
    const jac = page.locator('.react-flow__node[data-id="JAC"]');
    await expect.poll(() => jac.getAttribute("class")).toContain("selected");
    expect(await page.getByTestId("ws-state").inputValue()).toBe("charge");
    // The five readings taken while charging sit on the canvas between the parts they were taken across.
    await expect.poll(() => page.getByTestId("canvas-reading").count()).toBe(5);
    expect(await page.getByTestId("canvas-reading").allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining("1.05 V · model")]));
    await screenshot(page, "test-plan-suspect-canvas");
    expect(watch.problems).toEqual([]);
    await page.close();
  });
});
