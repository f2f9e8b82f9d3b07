import { describe, expect, it } from "vitest";
import { baseUrl, sharedBrowser, screenshot, watchPage } from "../support/browser";

const browser = sharedBrowser();

// 2/0 AWG copper at 25 C: ASTM B258 diameter 0.005 in x 92^(37/39), IEC 60028 resistivity 1.7241e-8 ohm m,
// x 1.02 stranding, x (1 + 0.00393 x 5) for temperature.
const d = 0.005 * 0.0254 * Math.pow(92, 37 / 39);
const rPerM = (1.7241e-8 / ((Math.PI / 4) * d * d)) * 1.02 * (1 + 0.00393 * 5);

describe("the start page's cranking check", () => {
  it("computes the drops a technician should expect, worked by hand", async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 1000 } });
    const watch = watchPage(page);
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    await page.getByTestId("qc-submit").click();
    await page.getByTestId("qc-battery-volts").waitFor();
    // Defaults: 12.6 V at rest, 6 mOhm inside, 180 A: 12.6 - 0.006 x 180 = 11.52 V at the posts.
    await expect(page.getByTestId("qc-battery-volts").textContent()).resolves.toBe("11.52 V");
    // Positive: 180 A x (0.2 mOhm clamp + 1.5 m x r); ground: 180 A x (1.5 mOhm bolt + 0.8 m x r).
    const positive = 180 * (0.0002 + 1.5 * rPerM);
    const ground = 180 * (0.0015 + 0.8 * rPerM);
    await expect(page.getByTestId("qc-drop-positive").textContent()).resolves.toBe(`${positive.toFixed(3)} V`);
    await expect(page.getByTestId("qc-drop-ground").textContent()).resolves.toBe(`${ground.toFixed(3)} V`);
    // A corroded ground bolt of 2 mOhm: 180 A x 2 mOhm = 0.36 V across it, over the 0.1 V per connection
    // of common practice, and shown as such.
    await page.getByTestId("qc-groundJointMilliohm").fill("2");
    await page.getByTestId("qc-submit").click();
    await page.waitForFunction(() => document.querySelector('[data-testid="qc-drop-joint-ground"]')?.textContent === "0.360 V");
    await expect(page.getByTestId("qc-drop-joint-ground").getAttribute("class")).resolves.toContain("text-over");
    await screenshot(page, "quick-check-1440");
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it("says what to fix for a value out of range, at a phone's width", async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 } });
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    await page.getByTestId("qc-restingVolts").fill("14.1");
    await page.getByTestId("qc-submit").click();
    await expect(page.getByRole("alert").first().textContent()).resolves.toMatch(/not at rest/);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "quick-check-390");
    await page.close();
  });
});
