import { NextResponse, type NextRequest } from "next/server";
import { pageCsp } from "@/lib/net/security-headers";

/**
 * Every page gets a fresh nonce and its Content Security Policy. Next.js reads the policy from the request headers
 * and puts the nonce on the scripts it writes. The proxy decides nothing about access: each page and route checks
 * the session itself.
 */
export function proxy(request: NextRequest) {
  const nonce = Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = pageCsp(nonce);
  const headers = new Headers(request.headers);
  headers.set("x-nonce", nonce);
  headers.set("content-security-policy", csp);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("content-security-policy", csp);
  return response;
}

export const config = {
  matcher: [
    {
      // Pages only: API answers, built assets and the icon have their own fixed headers (next.config.ts).
      source: "/((?!api/|_next/static|_next/image|icon.svg|favicon.ico).*)",
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
