import localFont from "next/font/local";

// Shipped with the app from npm font packages (SIL Open Font License); nothing is fetched at build time.
export const publicSans = localFont({
  src: [
    { path: "../node_modules/@fontsource-variable/public-sans/files/public-sans-latin-wght-normal.woff2", style: "normal", weight: "100 900" },
    { path: "../node_modules/@fontsource-variable/public-sans/files/public-sans-latin-wght-italic.woff2", style: "italic", weight: "100 900" },
  ],
  variable: "--font-public-sans",
  display: "swap",
});

export const jetbrainsMono = localFont({
  src: [{ path: "../node_modules/@fontsource-variable/jetbrains-mono/files/jetbrains-mono-latin-wght-normal.woff2", style: "normal", weight: "100 800" }],
  variable: "--font-jetbrains-mono",
  display: "swap",
});
