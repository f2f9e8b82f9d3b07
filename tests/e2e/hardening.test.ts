import http from "node:http";
import type { AddressInfo } from "node:net";
import type { BrowserContext } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/demo";
import { baseUrl, screenshot, sharedBrowser, signedInContext, watchPage } from "../support/browser";

const browser = sharedBrowser();
let priya: BrowserContext;
let other: http.Server;
let otherUrl = "";

/**
 * Another origin of the same site (127.0.0.1 on another port): the browser sends the app's SameSite=Lax cookies to
 * the app from pages here, so only the app's own origin check stands between such a page and a forged change.
 */
function otherSite(html: string) {
  return (req: http.IncomingMessage, res: http.ServerResponse) => {
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" });
    res.end(html);
  };
}

let page = "";
beforeAll(async () => {
  priya = await signedInContext(browser(), "priya@larkspur.example", DEMO_PASSWORD);
  other = http.createServer((req, res) => otherSite(page)(req, res));
  await new Promise<void>((resolve) => other.listen(0, "127.0.0.1", resolve));
  otherUrl = `http://127.0.0.1:${(other.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await priya?.close();
  await new Promise((r) => other.close(r));
});

async function jobCount(): Promise<number> {
  const res = await priya.request.get(`${baseUrl}/api/v1/jobs?limit=100`);
  expect(res.status()).toBe(200);
  const body = (await res.json()) as { jobs: unknown[]; nextCursor: string | null };
  expect(body.nextCursor).toBeNull();
  return body.jobs.length;
}

describe("the browser's side of hardening", () => {
  it("pages carry a Content Security Policy with a nonce, refuse framing, and still work", async () => {
    const p = await priya.newPage();
    const watch = watchPage(p);
    const res = await p.goto(`${baseUrl}/jobs`, { waitUntil: "networkidle" });
    const h = res!.headers();
    expect(h["content-security-policy"]).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
    expect(h["content-security-policy"]).toContain("frame-ancestors 'none'");
    expect(h["x-content-type-options"]).toBe("nosniff");
    expect(h["x-frame-options"]).toBe("DENY");
    expect(h["referrer-policy"]).toBe("strict-origin-when-cross-origin");
    expect(h["permissions-policy"]).toContain("microphone=()");
    // The page's own scripts ran under the policy: the jobs table is drawn and nothing was blocked.
    await p.getByTestId("header-user").waitFor();
    expect(watch.problems).toEqual([]);
    const api = await priya.request.get(`${baseUrl}/api/v1/organizations`);
    expect(api.headers()["content-security-policy"]).toBe("default-src 'none'; frame-ancestors 'none'");
    await p.close();

    page = `<!doctype html><title>Other site</title><iframe id="f" src="${baseUrl}/jobs" width="800" height="400"></iframe>`;
    const framer = await priya.newPage();
    await framer.goto(otherUrl, { waitUntil: "load" });
    await framer.waitForTimeout(1500);
    const child = framer.frames().find((f) => f !== framer.mainFrame());
    // A refused frame never becomes the app's page: no header of ours is inside it.
    const inside = child ? await child.locator("[data-testid=header-user]").count().catch(() => 0) : 0;
    expect(inside).toBe(0);
    await screenshot(framer, "framing-refused");
    await framer.close();
  });

  it("answers 400, never 500, to an address with broken percent-encoding, and ignores a client's own peer header", async () => {
    // %ED%A0%80 is a UTF-16 surrogate written as UTF-8 (not valid text); %FF is no UTF-8 at all.
    for (const path of ["/api/v1/jobs/%ED%A0%80", "/jobs/%FF", "/api/v1/circuits/%C0%AF/readings"]) {
      const res = await fetch(`${baseUrl}${path}`);
      expect(res.status, path).toBe(400);
    }
    // Forged addresses in both headers: the socket's own address (loopback) still meets the per-account limit's
    // neighbours' limit of five a minute, because neither header is believed.
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
        method: "POST",
        headers: { origin: baseUrl, "content-type": "application/json", "x-forwarded-for": `203.0.113.${i}`, "x-ampwright-peer": `198.51.100.${i}` },
        body: JSON.stringify({ email: "ruth@fernmoor.example", password: `not the password ${i}` }),
      });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it("a page on another origin of the same site cannot create a job with the user's cookies", async () => {
    const before = await jobCount();
    const body = JSON.stringify({ title: "Forged from another origin", organizationId: "org_demo_shop" });
    page = `<!doctype html><title>Other site</title>
      <form id="plain" method="POST" action="${baseUrl}/api/v1/jobs" enctype="text/plain" target="sink">
        <input name='${body.slice(0, -2)}' value='"}'>
      </form>
      <iframe name="sink"></iframe>
      <script>
        window.results = [];
        document.getElementById("plain").submit();
        fetch("${baseUrl}/api/v1/jobs", { method: "POST", credentials: "include", mode: "no-cors", headers: { "content-type": "text/plain" }, body: ${JSON.stringify(body)} })
          .then((r) => window.results.push("no-cors " + r.type), (e) => window.results.push("no-cors failed"));
        fetch("${baseUrl}/api/v1/jobs", { method: "POST", credentials: "include", headers: { "content-type": "application/json" }, body: ${JSON.stringify(body)} })
          .then((r) => window.results.push("cors " + r.status), (e) => window.results.push("cors failed"));
      </script>`;
    const p = await priya.newPage();
    await p.goto(otherUrl, { waitUntil: "load" });
    await p.waitForFunction(() => (window as unknown as { results: string[] }).results.length === 2, undefined, { timeout: 10_000 });
    await p.waitForTimeout(500);
    expect(await jobCount()).toBe(before);
    await p.close();
  });

  it("after signing in, a next= that points at another site lands on the jobs page instead", async () => {
    const context = await browser().newContext({ viewport: { width: 1280, height: 900 } });
    const p = await context.newPage();
    for (const next of ["//elsewhere.invalid/x", "/\\elsewhere.invalid/x", "https://elsewhere.invalid/"]) {
      await p.goto(`${baseUrl}/sign-in?next=${encodeURIComponent(next)}`, { waitUntil: "networkidle" });
      if (await p.getByTestId("sign-in-email").count()) {
        await p.getByTestId("sign-in-email").fill("sam@larkspur.example");
        await p.getByTestId("sign-in-password").fill(DEMO_PASSWORD);
        await p.getByTestId("sign-in-submit").click();
      }
      await p.waitForURL((u) => u.pathname === "/jobs" || u.hostname !== "127.0.0.1", { timeout: 15_000 });
      expect(new URL(p.url()).origin, next).toBe(new URL(baseUrl).origin);
      expect(new URL(p.url()).pathname).toBe("/jobs");
      await context.clearCookies();
    }
    await context.close();
  });
});
