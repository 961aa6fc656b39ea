import type { Metadata } from "next";
import { connection } from "next/server";
import localFont from "next/font/local";
import "./globals.css";

const sans = localFont({ src: "./fonts/Inter-Variable.woff2", weight: "100 900", variable: "--font-sans", display: "swap" });

export const metadata: Metadata = {
  title: { default: "Loopkeeper", template: "%s · Loopkeeper" },
  description: "Registry of liquid-cooler controller curves, board revisions, builds and shipped boards.",
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every screen renders per request: its scripts carry that response's CSP nonce (proxy.ts).
  await connection();
  return (
    <html lang="en" className={sans.variable}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
