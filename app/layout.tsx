import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
import { bodyFont, displayFont, monoFont } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Loxodrome", template: "%s · Loxodrome" },
  description: "Check, explain and keep the sensor calibrations of small uncrewed vehicles.",
};

export const viewport: Viewport = {
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f7f4ee" },
    { media: "(prefers-color-scheme: dark)", color: "#0d161b" },
  ],
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${bodyFont.variable} ${displayFont.variable} ${monoFont.variable}`}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
