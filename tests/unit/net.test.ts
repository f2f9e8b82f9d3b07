import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { clientAddress, parseTrustedProxies } from "@/lib/net/client-address";
import { safeLocalPath } from "@/lib/net/redirect";
import { inertName } from "@/lib/mail/templates";
import { contentDisposition } from "@/lib/report/files";
import { badTextReason, findBadText } from "@/lib/validators/text";

const req = (h: Record<string, string>) => new Headers(h);

describe("the caller's address", () => {
  beforeEach(() => {
    process.env.AMPWRIGHT_PEER_HEADER = "1";
  });
  afterEach(() => {
    delete process.env.AMPWRIGHT_PEER_HEADER;
  });

  it("is the socket's address when no proxy is trusted, whatever X-Forwarded-For says", () => {
    const none = parseTrustedProxies("");
    expect(clientAddress(req({ "x-ampwright-peer": "203.0.113.9", "x-forwarded-for": "198.51.100.1" }), none)).toBe("203.0.113.9");
    expect(clientAddress(req({ "x-ampwright-peer": "::ffff:203.0.113.9" }), none)).toBe("203.0.113.9");
  });

  it("walks X-Forwarded-For from the right past trusted proxies only", () => {
    const proxies = parseTrustedProxies("10.0.0.0/8, 127.0.0.1");
    // client 198.51.100.7 -> proxy 10.1.2.3 -> proxy 127.0.0.1 (the socket); the left-most entry is the client's own word.
    const h = req({ "x-ampwright-peer": "127.0.0.1", "x-forwarded-for": "6.6.6.6, 198.51.100.7, 10.1.2.3" });
    expect(clientAddress(h, proxies)).toBe("198.51.100.7");
    // A socket that is not a trusted proxy: its forwarded header is ignored.
    expect(clientAddress(req({ "x-ampwright-peer": "198.51.100.20", "x-forwarded-for": "10.9.9.9" }), proxies)).toBe("198.51.100.20");
    expect(clientAddress(req({ "x-ampwright-peer": "2001:db8::5", "x-forwarded-for": "1.2.3.4" }), parseTrustedProxies("2001:db8::/32"))).toBe("1.2.3.4");
  });

  it("is unknown when the request did not come through the app's own server", () => {
    delete process.env.AMPWRIGHT_PEER_HEADER;
    expect(clientAddress(req({ "x-ampwright-peer": "203.0.113.9" }), parseTrustedProxies(""))).toBe("unknown");
  });

  it("refuses a TRUSTED_PROXIES entry that is not an address or range", () => {
    expect(() => parseTrustedProxies("10.0.0.0/40")).toThrow(/prefix/);
    expect(() => parseTrustedProxies("proxy.local")).toThrow(/not an address/);
  });
});

describe("where to go after signing in", () => {
  it("keeps paths on this site and drops anything a browser could read as another site", () => {
    expect(safeLocalPath("/jobs/job_1?tab=files#x")).toBe("/jobs/job_1?tab=files#x");
    expect(safeLocalPath("/invitations/inv_abc")).toBe("/invitations/inv_abc");
    for (const bad of ["//elsewhere.invalid/x", "/\\elsewhere.invalid", "https://elsewhere.invalid", "javascript:alert(1)", "/\t/elsewhere.invalid", "jobs", "", null, 42]) {
      expect(safeLocalPath(bad), String(bad)).toBe("/jobs");
    }
  });
});

describe("text that cannot be stored", () => {
  it("names NUL characters and lone surrogates, and passes whole pairs", () => {
    expect(badTextReason("a\u0000b")).toMatch(/NUL/);
    expect(badTextReason("a\ud83d")).toMatch(/broken/);
    expect(badTextReason("\udc00a")).toMatch(/broken/);
    expect(badTextReason("battery 🔋 ok")).toBeUndefined();
    expect(findBadText({ a: [{ b: "ok" }, { c: "x\u0000" }] })).toEqual({ path: "a.1.c", reason: expect.stringMatching(/NUL/) });
  });
});

describe("names in mail and downloads", () => {
  it("makes links in a typed name inert and bounds its length", () => {
    expect(inertName("Visit https://prizes.example.com/claim now")).toBe("Visit https prizes[.]example[.]com/claim now");
    expect(inertName("Larkspur Road Auto Electric")).toBe("Larkspur Road Auto Electric");
    expect(inertName("St. John's Garage")).toBe("St. John's Garage");
    expect(inertName("x".repeat(100))).toHaveLength(60);
    expect(inertName("line\nbreak\u0000")).toBe("line break");
  });

  it("writes any file name as RFC 6266 with an ASCII fallback", () => {
    expect(contentDisposition("Mätvärde 1.jpg", true)).toBe(`inline; filename="Matvarde 1.jpg"; filename*=UTF-8''M%C3%A4tv%C3%A4rde%201.jpg`);
    expect(contentDisposition('a"b;c.pdf')).toBe(`attachment; filename="a_b_c.pdf"; filename*=UTF-8''a%22b%3Bc.pdf`);
    expect(contentDisposition("電圧.pdf")).toMatch(/^attachment; filename="__\.pdf"; filename\*=UTF-8''%E9%9B%BB%E5%9C%A7\.pdf$/);
  });
});
