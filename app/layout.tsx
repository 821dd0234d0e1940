import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { GeistMono } from "geist/font/mono";
import { connection } from "next/server";
import type { ReactNode } from "react";
import "./globals.css";

// Inter ships with the app (nothing is downloaded at build or run time). The Greek subset is a second
// family in the font stack so that Γ, Δ, Σ and χ in k-path labels and fit statistics use the same face.
const interLatin = localFont({
  src: "../public/fonts/inter-latin-wght-normal.woff2",
  variable: "--font-inter",
  weight: "100 900",
  display: "swap",
});

const interGreek = localFont({
  src: "../public/fonts/inter-greek-wght-normal.woff2",
  variable: "--font-inter-greek",
  weight: "100 900",
  display: "swap",
  preload: false,
});

export const metadata: Metadata = {
  title: { default: "Bandwright", template: "%s · Bandwright" },
  description: "Fit tight-binding models to DFT and ARPES band dispersions, as a team.",
  icons: { icon: "/favicon.svg" },
};

export const viewport: Viewport = { themeColor: "#1c5264" };

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request, none prerendered at build: Next can stamp each response's scripts
  // with that request's CSP nonce only while rendering it (proxy.ts).
  await connection();
  return (
    <html lang="en" className={`${interLatin.variable} ${interGreek.variable} ${GeistMono.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
