import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/demo";
import { baseUrl, sharedBrowser, screenshot, signedInContext, watchPage } from "../support/browser";

const browser = sharedBrowser();

describe("the sizing page", () => {
  it("sizes a 20 A light bar as the hand arithmetic does, and follows the typed units", async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 1000 } });
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/size`, { waitUntil: "networkidle" });
    // 20 A, 6 m one way, critical 3 % of 12 V = 0.36 V, cabin 30 C, TXL rated 125 C. Copper per metre at its operating
    // temperature (30 C + 95 x (20 A / ampacity)^2; Table 5 at 125 C: 8 AWG 90 A, 6 AWG 125 A), x 1.02 stranding:
    // 8 AWG 0.6282 ohm/kft (NBS) at 34.7 C -> 2.224 mOhm/m -> 20 A x 12 m = 0.534 V (too much); 6 AWG at 32.4 C
    // 1.387 mOhm/m -> 0.333 V. Fuse: 125 % of 20 A = 25 A blade (ISO 8820 series).
    await expect(page.getByTestId("size-recommended").textContent()).resolves.toBe("6 AWG");
    await expect(page.getByTestId("size-protection").textContent()).resolves.toBe("25 A blade fuse");
    await expect(page.getByTestId("size-reason").textContent()).resolves.toMatch(/voltage drop limit of 0\.36 V decided it/);
    await screenshot(page, "sizing-1440");
    // 3 m: 8 AWG drops 20 x 6 x 2.224 mOhm = 0.267 V (fits), 10 AWG (70 A, 37.8 C) 20 x 6 x 3.576 mOhm = 0.429 V (does not).
    await page.getByTestId("size-length").fill("3 m");
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "8 AWG");
    // 18 ft = 5.486 m: 6 AWG drops 20 x 10.97 x 1.387 mOhm = 0.304 V, 8 AWG 0.488 V.
    await page.getByTestId("size-length").fill("18 ft");
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "6 AWG");
    // A wrong unit says what to fix and keeps the other values.
    await page.getByTestId("size-length").fill("3 V");
    await expect(page.getByTestId("size-error-length").textContent()).resolves.toMatch(/not a length/);
    await expect(page.getByTestId("size-current").inputValue()).resolves.toBe("20 A");
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it("sizes a fictional winch install on intermittent duty, with the drop plotted against length", async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 1100 } });
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/size`, { waitUntil: "networkidle" });
    await page.getByTestId("size-current").fill("250 A");
    await page.getByTestId("size-length").fill("5 m");
    await page.getByTestId("size-circuitClass").selectOption("non-critical");
    await page.getByTestId("size-zone").selectOption("underbody");
    await page.getByTestId("size-insulation").selectOption("SGX");
    await page.getByTestId("size-duty").selectOption("intermittent");
    await page.getByTestId("size-onTime").fill("1 min");
    await page.getByTestId("size-period").fill("10 min");
    // Worked by hand. Limit: 10 % of 12 V = 1.2 V (ABYC E-11 non-critical). Underbody ambient 40 C, SGX rated 125 C.
    // Heat: 250 A x sqrt(60 s / 600 s) = 79.1 A duty-equivalent (common practice).
    // Device: it must hold 250 A for the whole minute. Representative bolt-in band (lib/conductors/devices.ts, from
    // memory): 150 A opens no sooner than 31 s at 167 % (too soon); 175 A at 143 % no sooner than 236 s: 175 A.
    // Cable: 175 A after derating, sqrt((125 - 40) / (125 - 30)) = 0.9459 (NFPA 70 310.15(B)(1)): 4 AWG 170 x 0.9459
    // = 160.8 A (too little), 2 AWG 225 x 0.9459 = 212.8 A (33 CFR 183.425 Table 5).
    // Drop at each size's operating temperature (rise with the square of the current, reaching 125 C at ampacity):
    // 2 AWG at 40 + 85 x (79.1 / 212.8)^2 = 51.7 C: 0.1563 / 304.8 x 1.02 x 1.1247 = 0.5883 mOhm/m x 10 m x 250 A =
    // 1.471 V (too much); 1 AWG (250.7 A) at 48.5 C: 0.1239 / 304.8 x 1.02 x 1.1118 = 0.4610 mOhm/m -> 1.152 V (fits).
    // NBS Handbook 100: 2 AWG 0.1563, 1 AWG 0.1239 ohm/kft at 20 C; x 1.02 stranding; alpha 0.00393 (IEC 60028).
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "1 AWG");
    await expect(page.getByTestId("size-protection").textContent()).resolves.toBe("175 A bolt-in fuse");
    await expect(page.getByTestId("size-reason").textContent()).resolves.toMatch(/voltage drop limit of 1\.2 V decided it/);
    // The plot shows the sizes around the answer and where each reaches the limit: 1.2 V / (250 A x 2 x 0.4610
    // mOhm/m) = 5.2 m one way for 1 AWG.
    await expect(page.getByTestId("size-chart").locator("svg.recharts-surface").count()).resolves.toBeGreaterThan(0);
    await expect(page.getByTestId("size-chart-summary").textContent()).resolves.toMatch(/1 AWG reaches the limit at 5\.2 m/);
    // The device's band against the load's peak: drawn, and the checks said in words.
    await expect(page.getByTestId("device-chart").locator("svg.recharts-surface").count()).resolves.toBeGreaterThan(0);
    await expect(page.getByTestId("device-checks").textContent()).resolves.toMatch(/Carries 250 A for 1 min: it may open no sooner than 3\.9 min/);
    await expect(page.getByTestId("device-checks").textContent()).resolves.toMatch(/Rated 175 A, within the 251 A the cable may carry/);
    await page.getByTestId("device-chart").scrollIntoViewIfNeeded();
    await screenshot(page, "sizing-winch-1440");
    // 4 m one way: 2 AWG drops 250 A x 8 m x 0.5883 mOhm/m = 1.177 V, under 1.2 V, so the answer falls a size.
    await page.getByTestId("size-length").fill("4 m");
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "2 AWG");
    await expect(page.getByTestId("size-protection").textContent()).resolves.toBe("175 A bolt-in fuse");
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it("keeps the inputs in the address, so a result can be bookmarked or sent", async () => {
    const page = await browser().newPage({ viewport: { width: 1280, height: 900 } });
    // The 3 m case worked above: 20 A over 3 m one way gives 8 AWG.
    await page.goto(`${baseUrl}/size?length=3%20m&zone=nowhere`, { waitUntil: "networkidle" });
    await expect(page.getByTestId("size-length").inputValue()).resolves.toBe("3 m");
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "8 AWG");
    // An unknown choice in the address is ignored; the default stays.
    await expect(page.getByTestId("size-zone").inputValue()).resolves.toBe("cabin");
    await page.getByTestId("size-current").fill("30 A");
    await page.waitForFunction(() => new URLSearchParams(location.search).get("current") === "30 A");
    expect(new URL(page.url()).searchParams.get("length")).toBe("3 m");
    await page.close();
  });

  it("keeps a sizing with a job: saved from the page, listed on the job, and reopened as it was typed", async () => {
    const signedOut = await browser().newPage();
    await signedOut.goto(`${baseUrl}/size`, { waitUntil: "networkidle" });
    await signedOut.getByTestId("size-save-signed-out").waitFor();
    await signedOut.close();

    const ctx = await signedInContext(browser(), "priya@larkspur.example", DEMO_PASSWORD);
    const page = await ctx.newPage();
    const watch = watchPage(page);
    // The winch worked by hand above, at 4 m one way: 2 AWG and a 175 A bolt-in fuse.
    await page.goto(`${baseUrl}/size?current=250%20A&length=4%20m&circuitClass=non-critical&zone=underbody&insulation=SGX&duty=intermittent`, { waitUntil: "networkidle" });
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "2 AWG");
    await page.getByTestId("size-save-job").selectOption("job_demo_van");
    const title = `Second winch, rear hitch ${Date.now() % 100000}`; // unique, so a rerun on the same data finds its own
    await page.getByTestId("size-save-title").fill(title);
    await page.getByTestId("size-save-button").click();
    await expect.poll(() => page.getByTestId("size-saved").textContent()).toBe(`Saved \u201c${title}\u201d (2 AWG) to Winch and inverter upfit.`);

    await page.goto(`${baseUrl}/jobs/job_demo_van`, { waitUntil: "networkidle" });
    const row = page.getByTestId("sizing-row").filter({ hasText: title });
    await expect(row.getByTestId("sizing-answer").textContent()).resolves.toBe("2 AWG, 175 A bolt-in fuse");
    await screenshot(page, "job-sizings-1280");
    await row.getByRole("link", { name: title }).click();
    await page.waitForURL(/\/size\?/);
    await expect(page.getByTestId("size-length").inputValue()).resolves.toBe("4 m");
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "2 AWG");
    expect(watch.problems).toEqual([]);
    await ctx.close();
  });

  it("works from the keyboard alone at a phone's width", async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 } });
    await page.goto(`${baseUrl}/size`, { waitUntil: "networkidle" });
    const focused = () => page.evaluate(() => document.activeElement?.getAttribute("data-testid"));
    for (let i = 0; i < 60 && (await focused()) !== "size-current"; i++) await page.keyboard.press("Tab");
    expect(await focused()).toBe("size-current");
    await page.keyboard.press("Control+A");
    await page.keyboard.type("30 A");
    await page.keyboard.press("Tab");
    expect(await focused()).toBe("size-length");
    await page.keyboard.press("Control+A");
    await page.keyboard.type("3 m");
    // 30 A over 3 m one way (6 m of copper), 3 % of 12 V = 0.36 V. At 30 C with the 1.02 stranding factor (NBS
    // Handbook 100 copper): 8 AWG 2.185 mOhm/m -> 30 x 6 x 2.185 mOhm = 0.393 V (too much); 6 AWG 1.374 mOhm/m ->
    // 0.247 V (fits).
    await page.waitForFunction(() => document.querySelector('[data-testid="size-recommended"]')?.textContent === "6 AWG");
    await page.close();
  });

  it("fits a phone without sideways scrolling", async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 } });
    await page.goto(`${baseUrl}/size`, { waitUntil: "networkidle" });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "sizing-390");
    await page.close();
  });
});
