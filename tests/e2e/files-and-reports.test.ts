import type { BrowserContext } from "playwright-core";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, demoShop } from "@/db/demo";
import { DEMO_SHARE_TOKEN, pickupCharging } from "@/db/demo-work";
import { baseUrl, screenshot, sharedBrowser, signedInContext, watchPage } from "../support/browser";
import { waitForMail } from "../support/maildev";

const browser = sharedBrowser();
let priya: BrowserContext;
beforeAll(async () => {
  priya = await signedInContext(browser(), "priya@larkspur.example", DEMO_PASSWORD);
});

/** Calls the API with the browser context's session, as the app's own pages do. */
async function api<T>(path: string, json: unknown): Promise<T> {
  const res = await priya.request.post(`${baseUrl}${path}`, { data: json, headers: { origin: baseUrl } });
  if (!res.ok()) throw new Error(`${path} answered ${res.status()}: ${await res.text()}`);
  return (await res.json()) as T;
}

describe("photos on readings, the printable report and a shared link", () => {
  it("a technician attaches a photo to a reading and sees its thumbnail beside it and on the job", async () => {
    const { job } = await api<{ job: { id: string } }>("/api/v1/jobs", { organizationId: demoShop.id, title: "Photo check, Unit 40", vehicle: "Unit 40", complaint: "Battery light" });
    const { circuit } = await api<{ circuit: { id: string } }>(`/api/v1/jobs/${job.id}/circuits`, { document: pickupCharging });
    await api(`/api/v1/circuits/${circuit.id}/readings`, { stateId: "charge", positive: "B1.neg", negative: "A1.case", value: 0.61, currentA: 40, note: "Case to battery negative" });

    const page = await priya.newPage();
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/circuits/${circuit.id}`, { waitUntil: "networkidle" });
    await page.getByTestId("reading-row").first().waitFor();
    // A meter photo stand-in: a 1200 x 900 JPEG made here (the server reads its type from the bytes).
    const jpeg = await sharp({ create: { width: 1200, height: 900, channels: 3, background: { r: 30, g: 60, b: 90 } } }).jpeg().toBuffer();
    await page.getByTestId("attach-reading-photo-input").setInputFiles({ name: "meter-case-to-neg.jpg", mimeType: "image/jpeg", buffer: jpeg });
    const thumb = page.getByTestId("reading-photos").getByTestId("attachment-thumbnail");
    await thumb.waitFor();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(320);

    // A program renamed as a photo is refused with the reason, and nothing is kept.
    const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(2048, 1)]);
    await page.getByTestId("attach-reading-photo-input").setInputFiles({ name: "not-a-photo.jpg", mimeType: "image/jpeg", buffer: elf });
    await expect.poll(() => page.getByTestId("reading-photos").getByTestId("api-error").textContent()).toContain("whatever its name says");
    await screenshot(page, "reading-photo");

    await page.goto(`${baseUrl}/jobs/${job.id}`, { waitUntil: "networkidle" });
    await page.getByTestId("file-card").waitFor();
    expect(await page.getByTestId("file-card").count()).toBe(1);
    expect(await page.getByTestId("file-card").textContent()).toContain("meter-case-to-neg.jpg");
    await expect.poll(() => page.getByTestId("file-grid").getByTestId("attachment-thumbnail").evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(320);
    await screenshot(page, "job-files");
    // The refused upload answered 422 on purpose; nothing else may fail.
    expect(watch.problems.filter((p) => !p.includes("/complete") && !p.includes("status of 422"))).toEqual([]);
    await page.close();
  });

  it("prints the job report, e-mails it with the PDF and a link, and opens the demo's shared link signed out", async () => {
    const page = await priya.newPage();
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/jobs/job_demo_unit14/report`, { waitUntil: "networkidle" });
    await page.getByTestId("job-report").waitFor();
    expect(await page.getByTestId("report-title").textContent()).toBeTruthy();
    expect(await page.getByTestId("report-drawing").count()).toBeGreaterThan(0);
    const pdf = await priya.request.get(`${baseUrl}/api/v1/jobs/job_demo_unit14/report.pdf`);
    expect(pdf.headers()["content-type"]).toBe("application/pdf");
    expect((await pdf.body()).subarray(0, 5).toString()).toBe("%PDF-");

    // E-mail it with a read-only link: a bad address is refused in the form, a good one goes out with the PDF.
    await page.getByTestId("report-email-open").click();
    await page.getByTestId("report-email-to").fill("not an address");
    await page.getByTestId("report-email-send").click();
    await page.getByTestId("report-email-form").getByRole("alert").first().waitFor();
    await page.getByTestId("report-email-to").fill("fleet.desk@customer.example");
    await page.getByTestId("report-email-link").check();
    await page.getByTestId("report-email-send").click();
    await page.getByTestId("report-email-sent").waitFor();
    const mail = (await waitForMail("fleet.desk@customer.example", /^Report: Battery light at idle/)) as Awaited<ReturnType<typeof waitForMail>> & { attachments?: { filename: string }[] };
    expect(mail.text).toContain("/shared/");
    expect(mail.attachments?.map((a) => a.filename)).toEqual([expect.stringMatching(/\.pdf$/)]);
    expect(watch.problems).toEqual([]);
    await page.close();

    const stranger = await browser().newContext();
    const shared = await stranger.newPage();
    const res = await shared.goto(`${baseUrl}/shared/${DEMO_SHARE_TOKEN}`, { waitUntil: "networkidle" });
    expect(res?.headers()["x-robots-tag"]).toContain("noindex");
    expect(await shared.locator('meta[name="robots"]').getAttribute("content")).toContain("noindex");
    await shared.getByTestId("job-report").waitFor();
    expect(await shared.getByTestId("report-found").textContent()).toBeTruthy();
    await screenshot(shared, "shared-report");
    expect((await shared.goto(`${baseUrl}/shared/not-a-real-token-at-all`))?.status()).toBe(404);
    await stranger.close();
  });
});
