import { describe, expect, it } from "vitest";
import { baseUrl, sharedBrowser, screenshot, watchPage } from "../support/browser";
import { firstLink, waitForMail } from "../support/maildev";

const browser = sharedBrowser();

describe("accounts in Chromium", () => {
  it("signs up, confirms the address from the mailed link, and is signed in", async () => {
    const email = `newtech-${Date.now().toString(36)}@larkspur.test`;
    const context = await browser().newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/sign-up`, { waitUntil: "networkidle" });
    // A short password is refused in the browser with what to fix.
    await page.getByTestId("sign-up-name").fill("Ada Quill");
    await page.getByTestId("sign-up-email").fill(email);
    await page.getByTestId("sign-up-password").fill("short");
    await page.getByTestId("sign-up-submit").click();
    await expect(page.getByRole("alert").first().textContent()).resolves.toMatch(/at least 10 characters/);
    await page.getByTestId("sign-up-password").fill("a long enough password");
    await page.getByTestId("sign-up-submit").click();
    await page.getByTestId("check-email").waitFor();
    await screenshot(page, "sign-up-check-email");
    const mail = await waitForMail(email, /Confirm your e-mail/);
    await page.goto(firstLink(mail.text), { waitUntil: "networkidle" });
    await page.waitForURL(/\/jobs/);
    await expect(page.getByTestId("header-user").textContent()).resolves.toBe("Ada Quill");
    expect(watch.problems.filter((p) => !p.includes("/api/auth/get-session"))).toEqual([]);
    await context.close();
  });

  it("signs in a demo technician, shows a clear error for a wrong password, and signs out", async () => {
    const context = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/sign-in`, { waitUntil: "networkidle" });
    await page.getByTestId("sign-in-email").fill("priya@larkspur.example");
    await page.getByTestId("sign-in-password").fill("not the password");
    await page.getByTestId("sign-in-submit").click();
    await expect(page.getByTestId("form-error").textContent()).resolves.toMatch(/do not match/);
    await screenshot(page, "sign-in-error-390");
    await page.getByTestId("sign-in-password").fill("larkspur-demo-2026"); // the demo password db/demo.ts defines
    await page.getByTestId("sign-in-submit").click();
    await page.waitForURL(/\/jobs/);
    await page.getByTestId("header-sign-out").click();
    await page.getByTestId("header-sign-in").waitFor();
    await context.close();
  });
});
