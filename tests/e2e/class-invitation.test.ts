import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { demoShop } from "@/db/demo";
import { baseUrl, sharedBrowser, screenshot } from "../support/browser";
import { firstLink, waitForMail } from "../support/maildev";

const browser = sharedBrowser();

async function signUpAndConfirm(page: Page, name: string, email: string, from = "/sign-up") {
  await page.goto(`${baseUrl}${from}`, { waitUntil: "networkidle" });
  await page.getByTestId("sign-up-name").fill(name);
  await page.getByTestId("sign-up-email").fill(email);
  await page.getByTestId("sign-up-password").fill("a sound password 9");
  await page.getByTestId("sign-up-submit").click();
  await page.getByTestId("check-email").waitFor();
  const mail = await waitForMail(email, /Confirm your e-mail/);
  await page.goto(firstLink(mail.text), { waitUntil: "networkidle" });
}

describe("an instructor invites a student into a class", () => {
  it("signs up, creates a class, invites by e-mail; the student accepts and sees the class", async () => {
    const tag = Date.now().toString(36);
    const instructorEmail = `instructor-${tag}@fernmoor.test`;
    const studentEmail = `student-${tag}@fernmoor.test`;

    const teacher = await (await browser().newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signUpAndConfirm(teacher, "Mira Castellan", instructorEmail);
    await teacher.goto(`${baseUrl}/organizations`, { waitUntil: "networkidle" });
    await teacher.getByTestId("org-name").fill("Auto Electrical 110, spring");
    await teacher.getByTestId("org-kind-class").check();
    await teacher.getByTestId("org-create").click();
    await teacher.waitForURL(/\/organizations\/org_/);
    await expect(teacher.getByTestId("org-my-role").textContent()).resolves.toBe("Owner");
    await teacher.getByTestId("invite-email").fill(studentEmail);
    await teacher.getByTestId("invite-role").selectOption("student");
    await teacher.getByTestId("invite-send").click();
    await teacher.getByTestId("invitation-list").waitFor();
    await expect(teacher.getByTestId("invitation-list").textContent()).resolves.toContain(`${studentEmail} as Student`);
    await screenshot(teacher, "class-invite-1440");

    const invite = await waitForMail(studentEmail, /Join Auto Electrical 110, spring/);
    expect(invite.text).toMatch(/Mira Castellan invites you to join .* as Student/);
    const link = new URL(firstLink(invite.text));

    const student = await (await browser().newContext({ viewport: { width: 390, height: 844 } })).newPage();
    await student.goto(link.toString(), { waitUntil: "networkidle" });
    await expect(student.getByTestId("invitation-summary").textContent()).resolves.toContain("as Student");
    await signUpAndConfirm(student, "Noor Brandt", studentEmail, `/sign-up?next=${encodeURIComponent(link.pathname)}`);
    await student.waitForURL(/\/invitations\//);
    await student.getByTestId("invitation-accept").click();
    await student.waitForURL(/\/organizations\/org_/);
    await expect(student.getByTestId("org-title").textContent()).resolves.toBe("Auto Electrical 110, spring");
    await expect(student.getByTestId("org-my-role").textContent()).resolves.toBe("Student");
    await screenshot(student, "class-joined-390");

    // Another organisation's page is simply not there for the student.
    const res = await student.goto(`${baseUrl}/organizations/${demoShop.id}`);
    expect(res?.status()).toBe(404);

    // The teacher now sees the student among the people.
    await teacher.reload({ waitUntil: "networkidle" });
    await expect(teacher.getByTestId("member-list").textContent()).resolves.toContain("Noor Brandt");
  });
});
