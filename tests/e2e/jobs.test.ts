import type { BrowserContext, Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/demo";
import { baseUrl, screenshot, sharedBrowser, signedInContext, watchPage } from "../support/browser";

const browser = sharedBrowser();
let priya: BrowserContext;
beforeAll(async () => {
  priya = await signedInContext(browser(), "priya@larkspur.example", DEMO_PASSWORD);
});

async function signIn(page: Page, email: string, next: string) {
  await page.goto(`${baseUrl}/sign-in?next=${encodeURIComponent(next)}`, { waitUntil: "networkidle" });
  await page.getByTestId("sign-in-email").fill(email);
  await page.getByTestId("sign-in-password").fill(DEMO_PASSWORD);
  await page.getByTestId("sign-in-submit").click();
  await page.waitForURL((u) => u.pathname === next);
}

const titles = (page: Page) => page.getByTestId("job-link").allTextContents();

describe("jobs, circuits, readings and history in the browser", () => {
  it("lists the shop's jobs with search, status filter and sort, and opens a new job with a circuit", async () => {
    const page = await priya.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/jobs`, { waitUntil: "networkidle" });
    await page.getByTestId("job-row").first().waitFor();
    expect(await page.getByTestId("jobs-org").textContent()).toContain("Larkspur Road Auto Electric");
    expect(await titles(page)).toEqual(expect.arrayContaining(["Battery light at idle", "Slow crank when cold", "Winch and inverter upfit"]));
    await screenshot(page, "jobs-list-1440");

    await page.getByTestId("jobs-search").fill("slow crank");
    await expect.poll(() => titles(page)).toEqual(["Slow crank when cold"]);
    await page.getByTestId("jobs-search").fill("");
    await page.getByTestId("jobs-status").selectOption("closed");
    await expect.poll(() => titles(page)).toEqual(["No-start, corroded negative clamp"]);
    await page.getByTestId("jobs-search").fill("no such job anywhere");
    await page.getByTestId("jobs-empty").waitFor();
    await page.getByRole("button", { name: "Clear the search and filter" }).click();
    await page.getByTestId("sort-title").click();
    await expect.poll(async () => {
      const t = await titles(page);
      return t.length > 2 && t.every((x, i) => i === 0 || t[i - 1].localeCompare(x) <= 0);
    }).toBe(true);

    await page.getByTestId("new-job").click();
    await page.getByTestId("job-create").click();
    expect(await page.getByTestId("new-job-form").textContent()).toContain("at least 2 characters");
    await page.getByTestId("job-title").fill("Dim headlamps at idle, Unit 22");
    await page.getByTestId("job-vehicle").fill("Unit 22, parts van");
    await page.getByTestId("job-complaint").fill("Headlamps dim at idle, brighten with revs.");
    await page.getByTestId("job-create").click();
    await page.waitForURL(/\/jobs\/job_/);
    await page.getByTestId("job-heading").waitFor();
    expect(await page.getByTestId("job-heading").textContent()).toBe("Dim headlamps at idle, Unit 22");
    await page.getByTestId("circuits-empty").waitFor();

    await page.getByTestId("job-status").selectOption("diagnosed");
    await page.reload({ waitUntil: "networkidle" });
    await expect.poll(() => page.getByTestId("job-status").inputValue()).toBe("diagnosed");

    await page.getByTestId("new-circuit-name").fill("Headlamp feed");
    await page.getByTestId("new-circuit").click();
    await page.waitForURL(/\/circuits\/cir_/);
    expect(await page.getByTestId("circuit-heading").textContent()).toBe("Headlamp feed");
    expect(await page.getByTestId("circuit-version").textContent()).toContain("Version 1");
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it("shows a demo circuit with its readings, and records a new reading", async () => {
    const page = await priya.newPage();
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/jobs/job_demo_unit14`, { waitUntil: "networkidle" });
    await page.getByTestId("circuit-link").first().waitFor();
    expect(await page.getByTestId("readings-summary").textContent()).toMatch(/1 circuit, \d+ readings taken/);
    await screenshot(page, "job-1440");
    await page.getByTestId("circuit-link").first().click();
    await page.waitForURL(/cir_demo_unit14_charging/);
    await page.getByTestId("reading-row").first().waitFor();
    const before = await page.getByTestId("reading-row").count();
    expect(before).toBeGreaterThanOrEqual(6);
    expect(await page.getByTestId("readings-table").textContent()).toContain("Engine block (GE.t)");
    expect(await page.getByTestId("parts-table").textContent()).toContain("Alternator mounting bracket");
    // Each reading is set against the solved circuit; block-to-case spans the bracket and its two links.
    const verdicts = await page.getByTestId("reading-verdict").allTextContents();
    expect(verdicts.some((v) => v.includes("W5, JAC, W4"))).toBe(true);
    expect(verdicts.some((v) => /as the model predicts|than predicted/.test(v))).toBe(true);
    // The demo's 12.44 V at rest: about 74 % on the BCI table; its 12.58 V while charging is under the window, whose
    // low end at the pickup's 30 C is 13.5 - 0.003 x 6 x 5 = 13.41 V (-3 mV per cell per degree, common practice).
    expect(verdicts.join(" ")).toContain("about 74 % charged");
    expect(verdicts.join(" ")).toContain("outside the window of 13.41 to 14.80 V at the circuit’s 30 °C");
    // Least squares over the readings: the bracket as drawn explains them, unless a test before fixed it in the model.
    expect(await page.getByTestId("suspects").textContent()).toMatch(/fit the circuit as drawn|JAC/);

    await page.getByTestId("reading-state").selectOption("charge");
    await page.getByTestId("reading-positive").selectOption("B1.pos");
    await page.getByTestId("reading-negative").selectOption("B1.neg");
    await page.getByTestId("reading-save").click();
    expect(await page.getByTestId("reading-form").textContent()).toContain("the number the meter showed");
    await page.getByTestId("reading-value").fill("12.61");
    await page.getByTestId("reading-current").fill("48");
    await page.getByTestId("reading-note").fill("After cleaning the bracket");
    await page.getByTestId("reading-save").click();
    await expect.poll(() => page.getByTestId("reading-row").count()).toBe(before + 1);
    expect(await page.getByTestId("readings-table").textContent()).toContain("12.61 V");
    await screenshot(page, "circuit-1440");
    expect(watch.problems).toEqual([]);
    await page.close();
  });

  it("catches a save over someone else's, compares both, saves knowingly, and restores from the history", async () => {
    const context = await browser().newContext({ viewport: { width: 1280, height: 900 } });
    const a = await context.newPage();
    await signIn(a, "tobias@larkspur.example", "/jobs/job_demo_van");
    await a.getByTestId("new-circuit-name").fill("Rear work lights");
    await a.getByTestId("new-circuit").click();
    await a.waitForURL(/\/circuits\/cir_/);
    const url = a.url();
    const b = await context.newPage();
    await b.goto(url, { waitUntil: "networkidle" });

    const edit = async (page: Page, name: string) => {
      await page.getByText("Edit the circuit document as text (JSON)").click();
      const doc = JSON.parse(await page.getByTestId("doc-text").inputValue());
      doc.components = [{ id: "B1", kind: "battery", label: name, openCircuitVoltage: 12.6, internalResistance: 0.006 }];
      doc.name = name;
      await page.getByTestId("doc-text").fill(JSON.stringify(doc, null, 2));
      await page.getByTestId("doc-save").click();
    };
    await edit(a, "Rear work lights, tab A");
    await a.getByText("Saved as version 2.").waitFor();

    await edit(b, "Rear work lights, tab B");
    await b.getByTestId("conflict-dialog").waitFor();
    const summary = await b.getByTestId("conflict-summary").textContent();
    expect(summary).toContain("name");
    expect(summary).toContain("B1");
    expect(await b.getByTestId("conflict-theirs").textContent()).toContain("tab A");
    await screenshot(b, "conflict-1280");
    await b.getByTestId("conflict-overwrite").click();
    await b.getByText("Saved as version 3.").waitFor();
    await expect.poll(() => b.getByTestId("circuit-heading").textContent()).toBe("Rear work lights, tab B");

    // A bad document is refused with the path to fix, and nothing is saved.
    await b.getByTestId("doc-text").fill('{"schema":"ampwright.circuit/1","name":"x","systemVoltage":"twelve","components":[],"wires":[]}');
    await b.getByTestId("doc-save").click();
    expect(await b.getByTestId("api-error").textContent()).toContain("systemVoltage");

    await b.getByTestId("history-link").click();
    await b.waitForURL(/\/history$/);
    await expect.poll(() => b.getByTestId("revision-item").count()).toBe(3);
    await b.getByTestId("revision-item").last().click();
    await b.getByTestId("restore").click();
    await expect.poll(() => b.getByTestId("revision-item").count()).toBe(4);
    expect(await b.getByTestId("revision-list").textContent()).toContain("Restored version 1");
    await screenshot(b, "history-1280");
    await context.close();
  });

  it("works at 390 px: the list scrolls inside its box, not the page; a student sees only their own jobs", async () => {
    const page = await browser().newPage({ viewport: { width: 390, height: 844 } });
    await signIn(page, "theo@fernmoor.example", "/jobs");
    await page.getByTestId("job-row").first().waitFor();
    const mine = await titles(page);
    expect(mine).toContain("Theo: positive-side practice");
    expect(mine).not.toContain("Ines: ground-side practice");
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "jobs-student-390");
    await page.close();
  });
});
