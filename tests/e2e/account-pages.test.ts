import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD, demoClass, demoShop } from "@/db/demo";
import { baseUrl, sharedBrowser, screenshot, watchPage } from "../support/browser";

const browser = sharedBrowser();

describe("account pages for a demo person", () => {
  it("shows the shop owner's organisations, people with role labels, and the account page", async () => {
    const page = await browser().newPage({ viewport: { width: 1440, height: 900 } });
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/sign-in?next=/organizations`, { waitUntil: "networkidle" });
    await page.getByTestId("sign-in-email").fill("dana@larkspur.example");
    await page.getByTestId("sign-in-password").fill(DEMO_PASSWORD);
    await page.getByTestId("sign-in-submit").click();
    await page.waitForURL(/\/organizations$/);
    await expect(page.getByTestId("org-list").textContent()).resolves.toContain(demoShop.name);
    await page.getByRole("link", { name: new RegExp(demoShop.name) }).click();
    await page.waitForURL(new RegExp(demoShop.id));
    const people = await page.getByTestId("member-list").textContent();
    expect(people).toContain("Shop lead");
    expect(people).toContain("Technician");
    await screenshot(page, "shop-people-1440");
    // The class is not this owner's: its page is not there for her.
    expect((await page.goto(`${baseUrl}/organizations/${demoClass.id}`))?.status()).toBe(404);
    await page.goto(`${baseUrl}/account`, { waitUntil: "networkidle" });
    await expect(page.getByRole("heading", { name: "Delete the account" }).count()).resolves.toBe(1);
    await page.getByTestId("header-org").waitFor();
    await screenshot(page, "account-1440");
    expect(watch.problems.filter((p) => !p.includes("404"))).toEqual([]); // the refused class page is a 404 on purpose
    await page.close();
  });

  it("sends a signed-out visitor to sign in and back", async () => {
    const page = await browser().newPage();
    await page.goto(`${baseUrl}/account`, { waitUntil: "networkidle" });
    expect(page.url()).toMatch(/\/sign-in\?next=%2Faccount$/);
    await page.close();
  });
});
