import type { BrowserContext } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, demoClass } from "@/db/demo";
import { benchTrainer } from "@/db/demo-work";
import { baseUrl, screenshot, sharedBrowser, signedInContext, watchPage } from "../support/browser";

const browser = sharedBrowser();
let lena: BrowserContext;
let ines: BrowserContext;
beforeAll(async () => {
  lena = await signedInContext(browser(), "lena@fernmoor.example", DEMO_PASSWORD);
  ines = await signedInContext(browser(), "ines@fernmoor.example", DEMO_PASSWORD);
});

describe("lessons in the browser", () => {
  it("an instructor publishes a lesson, a student opens it and makes a copy, and the instructor sees both", async () => {
    // The instructor's circuit in the class, made through the API the pages use.
    const post = async <T,>(path: string, data: unknown) => (await (await lena.request.post(`${baseUrl}${path}`, { data, headers: { origin: baseUrl } })).json()) as T;
    const { job } = await post<{ job: { id: string } }>("/api/v1/jobs", { organizationId: demoClass.id, title: "Lesson draft: slow charge" });
    const { circuit } = await post<{ circuit: { id: string } }>(`/api/v1/jobs/${job.id}/circuits`, { document: { ...benchTrainer, name: "Slow charge trainer" } });

    // A title of this run's own, so a rerun against the same database finds its own card.
    const title = `Where does the charge go? Group ${Date.now() % 1000}`;
    const page = await lena.newPage();
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/circuits/${circuit.id}`, { waitUntil: "networkidle" });
    await page.getByTestId("lesson-open-form").click();
    await page.getByTestId("lesson-title").fill("");
    await page.getByTestId("lesson-publish").click();
    expect(await page.getByTestId("lesson-form").textContent()).toContain("at least 2 characters");
    await page.getByTestId("lesson-title").fill(title);
    await page.getByTestId("lesson-brief").fill("Choose Charging, colour by voltage drop, and find the worst joint before you touch a meter.");
    await page.getByTestId("lesson-add-question").click();
    await page.getByTestId("lesson-question").fill("Which joint drops the most while charging?");
    await page.getByTestId("lesson-publish").click();
    await page.getByTestId("lesson-link").waitFor();
    expect(await page.getByTestId("lesson-status").textContent()).toContain("version 1");
    const href = (await page.getByTestId("lesson-link").getAttribute("href"))!;
    expect(href).toMatch(/^\/lessons\/lsn_/);
    expect(watch.problems).toEqual([]);

    // The student finds it in the list, opens it read-only with the live solve, and copies it.
    const s = await ines.newPage();
    const sWatch = watchPage(s);
    await s.goto(`${baseUrl}/lessons`, { waitUntil: "networkidle" });
    const card = s.getByTestId("lesson-card").filter({ hasText: title });
    await card.waitFor();
    expect(await card.getByTestId("lesson-card-status").textContent()).toContain("Not opened yet");
    await screenshot(s, "lessons-list");
    await card.getByTestId("lesson-card-link").click();
    await s.waitForURL((u) => u.pathname === href);
    await s.getByTestId("lesson-heading").waitFor();
    expect(await s.getByTestId("lesson-questions").textContent()).toContain("Which joint drops the most");
    await s.getByTestId("ws-canvas").locator(".react-flow__node").first().waitFor();
    expect(await s.getByTestId("ws-save").textContent()).toContain("Read only");
    await s.getByTestId("ws-state").selectOption("charge");
    await expect.poll(async () => s.getByTestId("ws-supply-now").textContent()).toBeTruthy();
    expect(await s.getByTestId("palette-battery").isDisabled()).toBe(true);
    await screenshot(s, "lesson-student");
    await s.getByTestId("lesson-copy").click();
    await s.waitForURL(/\/circuits\/cir_.*\/workspace$/);
    await s.getByTestId("ws-title").waitFor();
    expect(await s.getByTestId("ws-title").textContent()).toBe("Slow charge trainer");
    expect(await s.getByTestId("ws-save").textContent()).toContain("Saved, version 1");
    expect(await s.getByTestId("palette-battery").isDisabled()).toBe(false);
    expect(sWatch.problems).toEqual([]);
    await s.close();

    // The instructor sees who opened it and who copied it.
    await page.goto(`${baseUrl}${href}`, { waitUntil: "networkidle" });
    const row = page.getByTestId("lesson-activity-row").filter({ hasText: "Ines Karlsen" });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/1 time.*version 1.*✓/);
    expect(await page.getByTestId("lesson-activity-row").filter({ hasText: "Theo Marsh" }).textContent()).toContain("not yet");
    await screenshot(page, "lesson-instructor");
    await page.close();
  });
});
