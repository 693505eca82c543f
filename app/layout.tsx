import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import "@fontsource/jetbrains-mono/400.css";
import "@fontsource/jetbrains-mono/600.css";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Clockgraft", template: "%s · Clockgraft" },
  description: "Replace analog timing stages with exact microcontroller timers.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1 };

// Every page renders per request: its scripts carry that request's CSP nonce (proxy.ts).
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  return (
    <html lang="en">
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
