import type { Metadata, Viewport } from "next";
import { GeistMono } from "geist/font/mono";
import type { ReactNode } from "react";
import { interGreek, interLatin } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Bandwright", template: "%s · Bandwright" },
  description: "Fit tight-binding models to DFT and ARPES band dispersions, as a team.",
  icons: { icon: "/favicon.svg" },
};

export const viewport: Viewport = { themeColor: "#1c5264" };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${interLatin.variable} ${interGreek.variable} ${GeistMono.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
