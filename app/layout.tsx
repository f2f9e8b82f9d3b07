import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import { Providers } from "@/components/providers";
import { SiteFooter } from "@/components/shell/site-footer";
import { SiteHeader } from "@/components/shell/site-header";
import { jetbrainsMono, publicSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Ampwright", template: "%s · Ampwright" },
  description:
    "Prove where a charging or starting fault is before buying parts, size cables and fuses for added loads, and teach the method with worked circuits.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#1d2125" };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request, so each gets the fresh nonce of its Content Security Policy (proxy.ts).
  await connection();
  return (
    <html lang="en" className={`${publicSans.variable} ${jetbrainsMono.variable}`}>
      <body className="flex min-h-dvh flex-col antialiased">
        <Providers>
          <SiteHeader />
          <main className="flex-1">{children}</main>
          <SiteFooter />
        </Providers>
      </body>
    </html>
  );
}
